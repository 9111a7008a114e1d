#!/usr/bin/env node
// The last step of `npm run build -w storefront`: writes each page's prerendered markup and its
// emotion style tags into the HTML files the client build left in dist/ (see src/prerender.tsx,
// built for Node into dist-prerender/ by `vite build --ssr`). home.html and configure.html get
// their page, marked `data-prerendered` with its path so the browser hydrates it; index.html, which
// answers every other page, gets the layout with a loading line (drawn afresh by the browser).
import { readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

// React, emotion and Joy as the browser's production build runs them (the same class names and markup).
process.env.NODE_ENV ??= 'production';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dist = path.join(root, 'dist');
const built = path.join(root, 'dist-prerender');
const { prerenderPage, prerenderShell } = await import(pathToFileURL(path.join(built, 'prerender.js')).href);

const pages = [
  { file: 'index.html', render: () => prerenderShell() },
  { file: 'home.html', path: '/', render: () => prerenderPage('/') },
  { file: 'configure.html', path: '/configure', render: () => prerenderPage('/configure') },
];

const container = '<div id="root"></div>';
for (const page of pages) {
  const file = path.join(dist, page.file);
  const source = readFileSync(file, 'utf8');
  if (!source.includes(container)) throw new Error(`prerender: ${page.file} has no empty ${container}`);
  const { html, styles } = await page.render();
  const marked = page.path ? `<div id="root" data-prerendered="${page.path}">` : '<div id="root">';
  const out = source.replace('</head>', `${styles}\n  </head>`).replace(container, () => `${marked}${html}</div>`);
  writeFileSync(file, out);
  console.log(`prerender: ${page.file} ${(Buffer.byteLength(out) / 1000).toFixed(1)} kB (${page.path ?? 'layout only'})`);
}
rmSync(built, { recursive: true, force: true });
