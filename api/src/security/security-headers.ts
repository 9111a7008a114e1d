import type { RequestHandler } from 'express';
import helmet from 'helmet';

/**
 * The Content-Security-Policy both built apps, the API's answers and the Swagger page run under.
 * Scripts come only from our own origin: Vite's build emits no inline script, so `'unsafe-inline'`
 * is never given to scripts (and neither is `'unsafe-eval'`).
 *
 * Styles do get `'unsafe-inline'`: Joy UI styles through emotion, which writes `<style>` elements
 * into the page as components mount, and the Swagger page ships inline `<style>` blocks. The
 * alternative, a per-request nonce handed to emotion's cache, would need index.html rendered per
 * request instead of served as a static file. Injected CSS cannot run code; the script rules and
 * `connect-src 'self'` are what stop injected markup from acting or sending data away.
 */
const appDirectives = {
  'default-src': ["'self'"],
  'script-src': ["'self'"],
  'style-src': ["'self'", "'unsafe-inline'"],
  // data: for icons inlined into CSS (Swagger UI); blob: for a photo previewed before upload.
  'img-src': ["'self'", 'data:', 'blob:'],
  'font-src': ["'self'"],
  'connect-src': ["'self'"],
  'object-src': ["'none'"],
  'base-uri': ["'self'"],
  'form-action': ["'self'"],
  'frame-ancestors': ["'none'"],
};

/**
 * The build sheet is a PDF opened in its own tab. Chromium shows a PDF inside a page it makes up,
 * which embeds the document (so `object-src 'none'` leaves it blank) and styles itself inline
 * (Chromium issue 271452); a PDF runs none of our scripts, so nothing else is opened up.
 */
export const PDF_CONTENT_SECURITY_POLICY =
  "default-src 'none'; object-src 'self'; frame-src 'self'; style-src 'unsafe-inline'; img-src 'self' data:; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/**
 * helmet on every answer (apps, API, Swagger page): the CSP above; X-Frame-Options DENY for
 * browsers that predate frame-ancestors; nosniff; Referrer-Policy no-referrer, so a reset or
 * invitation link in the address bar never leaks to another site; HSTS in production only (a
 * development browser on http://localhost must not learn it). helmet also drops X-Powered-By.
 */
export function securityHeaders(production: boolean): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: production ? { ...appDirectives, 'upgrade-insecure-requests': [] } : appDirectives,
    },
    strictTransportSecurity: production ? { maxAge: 365 * 24 * 60 * 60, includeSubDomains: true } : false,
    referrerPolicy: { policy: 'no-referrer' },
    xFrameOptions: { action: 'deny' },
  });
}
