import path from 'node:path';
import { constants } from 'node:zlib';
import react from '@vitejs/plugin-react';
import type { Plugin } from 'vite';
import { compression, defineAlgorithm } from 'vite-plugin-compression2';
import { defineConfig } from 'vitest/config';
import { componentTests } from '../shared/src/ui/component-tests.config';
import { routePages } from './route-pages';

const apiTarget = process.env.API_URL ?? 'http://localhost:3000';

// shared/ is pure (no I/O, no globals), so a page that needs one helper from its index must not
// carry the whole engine, zod and decimal.js along with it.
const sharedIsPure = (id: string) => !id.includes('/shared/src/');

/**
 * Joy builds a complete default theme when its styles are imported (`extendTheme()` at the top of
 * @mui/joy/styles/defaultTheme.js: the longest single step of the storefront's start, 20 ms of a
 * phone's main thread, paid before the page's own theme is built), for components drawn outside a
 * theme provider. Every page of the built storefront (and its prerender) is drawn inside
 * CssVarsProvider with the shop's theme (src/app/providers.tsx), where Joy never reads its default,
 * so the build gives Joy an empty one: only the colour-scheme names its CssVarsProvider checks at
 * import. Component tests, which may draw outside the provider, keep Joy's own.
 */
const joyDefaultThemeUnused = (): Plugin => ({
  name: 'loomwright:joy-default-theme-unused',
  apply: 'build',
  enforce: 'pre',
  resolveId(source, importer) {
    if (importer && /[\\/]@mui[\\/]joy[\\/]/.test(importer) && /(^|\/)defaultTheme(\.js)?$/.test(source)) return '\0joy-default-theme';
    return null;
  },
  load(id) {
    return id === '\0joy-default-theme' ? 'export default { colorSchemes: { light: {}, dark: {} } };' : null;
  },
});

const clientPlugins = () => [
  joyDefaultThemeUnused(),
  react(),
  // `/` and `/configure` (the two first loads the bench measures) name their lazy chunks and the
  // price book up front; every page preloads the three Manrope weights the theme uses.
  routePages(
    [
      { file: 'home.html', modules: ['/src/app/routes/home.tsx'], prerendered: true },
      {
        file: 'configure.html',
        modules: ['/src/app/routes/configure.tsx'],
        fetches: ['/api/catalog'],
        prerendered: true,
      },
    ],
    /manrope-latin-(400|600|700)-normal-[\w-]+\.woff2$/,
  ),
  // Each script and style sheet also as .br (brotli 11) and .gz (gzip 9), made once here; the API
  // sends the copy the browser accepts instead of compressing on every request.
  compression({
    include: /\.(js|css)$/,
    threshold: 0,
    algorithms: [
      defineAlgorithm('brotliCompress', { params: { [constants.BROTLI_PARAM_QUALITY]: 11 } }),
      defineAlgorithm('gzip', { level: 9 }),
    ],
  }),
];

// Two builds: the browser's (dist/), and `vite build --ssr src/prerender.tsx` (dist-prerender/), a
// Node module scripts/prerender.mjs runs once to write the first pages' markup into dist/'s HTML.
// The second bundles every package (Node cannot import Joy's component folders as they are) and
// writes no pages, no manifest and no compressed copies.
export default defineConfig(({ isSsrBuild }) => ({
  plugins: isSsrBuild ? [joyDefaultThemeUnused(), react()] : clientPlugins(),
  base: '/',
  resolve: {
    alias: {
      // React Router 7's package sends every bundler to its development build; the production build
      // it ships beside it differs only in leaving the development warnings out (0.4 kB gzipped).
      'react-router': path.resolve(__dirname, '../node_modules/react-router/dist/production/index.mjs'),
      src: path.resolve(__dirname, 'src'),
      '@loomwright/shared/ui/testing': path.resolve(__dirname, '../shared/src/ui/testing.tsx'),
      '@loomwright/shared/ui': path.resolve(__dirname, '../shared/src/ui/index.ts'),
      '@loomwright/shared/joy-theme': path.resolve(__dirname, '../shared/src/joy-theme.ts'),
      '@loomwright/shared': path.resolve(__dirname, '../shared/src/index.ts'),
    },
  },
  server: { port: 5173, proxy: { '/api': apiTarget } },
  ssr: { noExternal: isSsrBuild ? true : undefined },
  build: isSsrBuild
    ? { outDir: 'dist-prerender', sourcemap: false, minify: false, rollupOptions: { treeshake: { moduleSideEffects: sharedIsPure } } }
    : {
        outDir: 'dist',
        sourcemap: false,
        manifest: true,
        modulePreload: { polyfill: false },
        rollupOptions: {
          treeshake: { moduleSideEffects: (id: string) => sharedIsPure(id) && !id.includes('/hoist-non-react-statics/') },
          // Everything the entry imports statically is needed by every page before it can draw, so it
          // ships as one chunk (Rolldown's built-in `$initial` tag) instead of the entry plus the small
          // common chunks automatic splitting cut out of it: one file compresses better than several.
          output: { codeSplitting: { groups: [{ name: 'storefront', tags: ['$initial'] }] } },
        },
      },
  test: componentTests('storefront', __dirname),
}));
