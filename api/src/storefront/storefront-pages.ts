/**
 * serve-static options that answer a page with its own copy of index.html when the build made one:
 * `/` with home.html and `/configure` with configure.html (each preloads its first screen's code
 * and data); any other page gets no file here and falls back to index.html.
 */
export const storefrontPageFiles = { index: ['home.html', 'index.html'], extensions: ['html'] };
