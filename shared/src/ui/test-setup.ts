// vitest setup for both apps' jsdom projects (`setupFiles` in each vite.config.ts).
// jsdom has no matchMedia; Joy's colour-scheme provider asks it for the preferred scheme.
import { cleanup } from '@testing-library/react';
import { afterEach, vi } from 'vitest';
import { matchMediaWhere } from './testing';

window.matchMedia ??= matchMediaWhere(() => false);

// After every test: unmount what it rendered and put back what it stubbed (`stubFetch`, `vi.stubGlobal`).
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});
