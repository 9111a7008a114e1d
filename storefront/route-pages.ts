import type { Plugin, Rolldown } from 'vite';

type OutputAsset = Rolldown.OutputAsset;
type OutputBundle = Rolldown.OutputBundle;
type OutputChunk = Rolldown.OutputChunk;

/** A page that gets its own copy of index.html, naming up front what its first screen needs. */
export interface RoutePage {
  /** The file beside index.html; the API's static server answers `/configure` with `configure.html`. */
  file: string;
  /** Modules the page loads lazily on its first screen (path suffixes): their chunks are preloaded. */
  modules: string[];
  /** GET requests of the API the first screen makes (each is preloaded as a fetch). */
  fetches?: string[];
}

/**
 * Build-only Vite plugin. Every page's HTML preloads the shop's web fonts (the Manrope files the
 * app ships), so text is first drawn in its own face instead of moving when the font arrives;
 * each `RoutePage` also gets its own HTML file with `<link rel="modulepreload">` for its lazy
 * chunks (and their imports) and `<link rel="preload" as="fetch">` for its API reads, so the
 * browser fetches them beside the entry instead of one round trip after another.
 */
export function routePages(pages: RoutePage[], fonts: RegExp): Plugin {
  return {
    name: 'loomwright:route-pages',
    apply: 'build',
    enforce: 'post',
    generateBundle: {
      order: 'post',
      handler(_options, bundle: OutputBundle) {
        const index = bundle['index.html'] as OutputAsset | undefined;
        if (!index || index.type !== 'asset') return this.error('route-pages: index.html is not in the bundle');
        const chunks = Object.values(bundle).filter((c): c is OutputChunk => c.type === 'chunk');
        const fontTags = Object.values(bundle)
          .filter((a) => a.type === 'asset' && fonts.test(a.fileName))
          .map((a) => `<link rel="preload" as="font" type="font/woff2" crossorigin href="/${a.fileName}">`);
        const withHead = (html: string, tags: string[]) => html.replace('</head>', `  ${tags.join('\n    ')}\n  </head>`);
        const html = withHead(String(index.source), fontTags);
        index.source = html;

        for (const page of pages) {
          const files = new Set<string>();
          const add = (chunk: OutputChunk) => {
            if (files.has(chunk.fileName)) return;
            files.add(chunk.fileName);
            for (const name of chunk.imports) add(bundle[name] as OutputChunk);
          };
          for (const suffix of page.modules) {
            const chunk = chunks.find((c) => c.facadeModuleId?.endsWith(suffix));
            if (!chunk) return this.error(`route-pages: no chunk for ${suffix} (is it still loaded lazily?)`);
            add(chunk);
          }
          const tags = [
            ...[...files]
              .filter((file) => !html.includes(`/${file}"`))
              .map((file) => `<link rel="modulepreload" crossorigin href="/${file}">`),
            ...(page.fetches ?? []).map((url) => `<link rel="preload" as="fetch" crossorigin="anonymous" href="${url}">`),
          ];
          this.emitFile({ type: 'asset', fileName: page.file, source: withHead(html, tags) });
        }
      },
    },
  };
}
