import { existsSync, statSync } from 'node:fs';
import path from 'node:path';
import type { NextFunction, Request, Response } from 'express';
import { isStorefrontPath } from '@loomwright/shared';

/**
 * Express middleware in front of the storefront's static files. A path that is neither a page of
 * the storefront's router, nor a file of its build, nor under /api or /backoffice, gets a real
 * 404: the app's index.html (which shows its "not found" page) when a browser asks for a page, a
 * line of text otherwise. Without it the single-page fallback answered 200 to every address.
 */
export function storefrontNotFound(distDir: string) {
  const indexFile = path.join(distDir, 'index.html');
  return (req: Request, res: Response, next: NextFunction) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const pathname = req.path;
    if (pathname === '/api' || pathname.startsWith('/api/') || pathname === '/backoffice' || pathname.startsWith('/backoffice/'))
      return next();
    if (isStorefrontPath(pathname)) return next();
    const file = path.join(distDir, path.normalize(decodeURIComponentSafe(pathname)).replace(/^([/\\])+/, ''));
    if (file.startsWith(distDir + path.sep) && existsSync(file) && statSync(file).isFile()) return next();
    res.status(404);
    res.setHeader('Cache-Control', 'no-cache');
    const wantsPage = !path.extname(pathname) && req.accepts(['html', 'json', 'text']) === 'html';
    if (wantsPage && existsSync(indexFile)) {
      // Read per request, as the static server does, so a new build is served without a restart.
      res.sendFile(indexFile, { headers: { 'Cache-Control': 'no-cache' } }, (error) => error && next(error));
      return;
    }
    res.type('text').send(`There is nothing at ${pathname}.`);
  };
}

function decodeURIComponentSafe(value: string): string {
  try {
    return decodeURIComponent(value);
  } catch {
    return value;
  }
}
