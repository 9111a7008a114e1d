import { minifySync, type Plugin, type Rolldown } from 'vite';

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
  /**
   * The build prerenders the page into its HTML (scripts/prerender.mjs): its modules are then
   * asked for once that markup has been painted (`loadModulesAfterFirstPaint`), not beside it.
   */
  prerendered?: boolean;
}

/**
 * Runs in the browser, as the classic script a prerendered page names instead of its module
 * scripts (`data-modules`: the entry, then the chunks to preload). The page's words are already in
 * its HTML; its scripts only bring them to life, so they are asked for once the browser has painted
 * those words, and the style sheet, the fonts and the page itself do not share the line with them.
 * A hidden tab (which paints nothing) loads them at once, and any page does after 3 s without a
 * reported paint (a browser without paint timing).
 */
function loadModulesAfterFirstPaint() {
  // A page's first number format loads the browser's ICU number data (12–25 ms of one task on a
  // desktop core, whatever locale and currency it asks for; every later format takes well under
  // 1 ms). Done here, in a task of its own, it does not lengthen the render that shows the first price.
  new Intl.NumberFormat().format(0);
  const [entry, ...chunks] = JSON.parse((document.currentScript as HTMLScriptElement).dataset.modules ?? '[]') as string[];
  let started = false;
  const start = () => {
    if (started) return;
    started = true;
    for (const href of chunks) {
      const link = document.createElement('link');
      link.rel = 'modulepreload';
      link.crossOrigin = '';
      link.href = href;
      document.head.append(link);
    }
    const script = document.createElement('script');
    script.type = 'module';
    script.crossOrigin = '';
    script.src = entry;
    document.head.append(script);
  };
  if (document.visibilityState !== 'visible') start();
  // `buffered`: a paint that came before this script ran is reported too.
  new PerformanceObserver((list) => list.getEntriesByName('first-contentful-paint').length && start()).observe({
    type: 'paint',
    buffered: true,
  });
  setTimeout(start, 3000);
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
        // The loader a prerendered page starts its modules with, as its own small classic script.
        const loader = minifySync('after-first-paint.js', `(${loadModulesAfterFirstPaint.toString()})();`);
        if (loader.errors.length) return this.error(`route-pages: ${loader.errors[0].message}`);
        const loaderFile = this.getFileName(this.emitFile({ type: 'asset', name: 'after-first-paint.js', source: loader.code }));
        const afterFirstPaint = (page: string) => {
          const modules = [
            ...page.matchAll(
              /<script type="module" crossorigin src="([^"]+)"><\/script>|<link rel="modulepreload" crossorigin href="([^"]+)">/g,
            ),
          ];
          const entry = modules.find((m) => m[1]);
          if (!entry) return this.error('route-pages: no module script in index.html');
          let out = page;
          for (const m of modules) out = out.replace(m[0], '');
          const list = [entry[1], ...modules.filter((m) => m[2]).map((m) => m[2])];
          return out.replace('</head>', `  <script defer src="/${loaderFile}" data-modules='${JSON.stringify(list)}'></script>\n  </head>`);
        };

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
          this.emitFile({
            type: 'asset',
            fileName: page.file,
            source: page.prerendered ? afterFirstPaint(withHead(html, tags)) : withHead(html, tags),
          });
        }
      },
    },
  };
}
