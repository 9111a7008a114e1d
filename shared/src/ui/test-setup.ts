// vitest setup for both apps' jsdom projects (`setupFiles` in each vite.config.ts).
// jsdom has no matchMedia; Joy's colour-scheme provider asks it for the preferred scheme.
window.matchMedia ??= (query: string) =>
  ({
    matches: false,
    media: query,
    onchange: null,
    addListener() {},
    removeListener() {},
    addEventListener() {},
    removeEventListener() {},
    dispatchEvent: () => false,
  }) as MediaQueryList;
