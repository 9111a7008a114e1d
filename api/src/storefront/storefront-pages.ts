import expressStaticGzip from 'express-static-gzip';

/**
 * serve-static options that answer a page with its own copy of index.html when the build made one:
 * `/` with home.html and `/configure` with configure.html (each preloads its first screen's code
 * and data); any other page gets no file here and falls back to index.html.
 */
export const storefrontPageFiles = { index: ['home.html', 'index.html'], extensions: ['html'] };

/**
 * The storefront's build writes each script and style sheet beside its brotli (.br) and gzip (.gz,
 * level 9) copies. They are sent as they are, with Content-Encoding and `Vary: Accept-Encoding`:
 * brotli when the browser accepts it, else gzip, else the plain file; nothing is compressed per
 * request (the `compression` middleware leaves an answer that already has an encoding alone).
 */
export function precompressedAssets(
  assetsDir: string,
  setHeaders: (res: { setHeader(name: string, value: string): void }, filePath: string) => void,
) {
  return expressStaticGzip(assetsDir, { enableBrotli: true, orderPreference: ['br', 'gzip'], index: false, serveStatic: { setHeaders } });
}
