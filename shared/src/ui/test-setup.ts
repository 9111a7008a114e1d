// vitest setup for both apps' jsdom projects (`setupFiles` in each vite.config.ts).
// jsdom has no matchMedia; Joy's colour-scheme provider asks it for the preferred scheme.
import { matchMediaWhere } from './testing';

window.matchMedia ??= matchMediaWhere(() => false);
