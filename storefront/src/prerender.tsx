import createCache from '@emotion/cache';
import { CacheProvider } from '@emotion/react';
import createEmotionServer from '@emotion/server/create-instance';
import { StrictMode, type ReactNode } from 'react';
import { renderToString } from 'react-dom/server';
import { prerenderToNodeStream } from 'react-dom/static';
import { Route, Routes, StaticRouter } from 'react-router';
import { AppProviders } from 'src/app/providers';
import { AppRoutes } from 'src/app/router';
import { AppLayout } from 'src/components/AppLayout';
import { PageLoading } from 'src/components/PageLoading';

/**
 * The build's prerender (run by `scripts/prerender.mjs` after the client build, never shipped to a
 * browser): a page drawn as the browser's first render draws it, before any request has answered
 * (the shop, the session, the price book all still on their way), and the style sheets Joy's
 * components wrote for it through emotion, as `<style data-emotion>` tags for the page's head.
 * The browser's emotion cache finds those tags and does not write the same rules again.
 */
export interface PrerenderedPage {
  /** The markup for `<div id="root">`. */
  html: string;
  /** `<style>` tags for `<head>`. */
  styles: string;
}

async function draw(tree: (children: ReactNode) => ReactNode, wait: boolean): Promise<PrerenderedPage> {
  const cache = createCache({ key: 'css' });
  const emotion = createEmotionServer(cache);
  const app = (
    <StrictMode>
      <CacheProvider value={cache}>
        <AppProviders>{tree(null)}</AppProviders>
      </CacheProvider>
    </StrictMode>
  );
  let html: string;
  if (wait) {
    // prerender waits for the page's lazy chunk, so the page itself is in the markup, not its loading line.
    const { prelude } = await prerenderToNodeStream(app);
    const parts: Buffer[] = [];
    for await (const part of prelude) parts.push(Buffer.from(part as Uint8Array));
    html = Buffer.concat(parts).toString('utf8');
  } else {
    html = renderToString(app);
  }
  return { html, styles: emotion.constructStyleTagsFromChunks(emotion.extractCriticalToChunks(html)) };
}

/** One page of the router at `path`, as `hydrateRoot` will find it. */
export function prerenderPage(path: string): Promise<PrerenderedPage> {
  return draw(
    () => (
      <StaticRouter location={path}>
        <AppRoutes />
      </StaticRouter>
    ),
    true,
  );
}

/** The layout with the loading line where a page goes: what every other page first shows. */
export function prerenderShell(): Promise<PrerenderedPage> {
  return draw(
    () => (
      <StaticRouter location="/">
        <Routes>
          <Route path="*" element={<AppLayout />}>
            <Route path="*" element={<PageLoading />} />
          </Route>
        </Routes>
      </StaticRouter>
    ),
    false,
  );
}
