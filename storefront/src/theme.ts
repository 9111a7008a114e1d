import type { Theme } from '@mui/joy/styles';
import { createLoomwrightTheme } from '@loomwright/shared/joy-theme';

let built: Theme | undefined;

/**
 * The storefront's one theme object, light only: the storefront has no dark mode, and without the
 * dark scheme Joy's CssVarsProvider neither builds its variables nor writes their style sheet on
 * every page's first render (12.8 kB and 330 custom properties less CSS on `/configure`).
 *
 * Built on first use, not on import: building it is one of the longest single steps of the page's
 * start (Joy works out every colour variable and variant, 10–20 ms of a phone's main thread), and
 * main.tsx gives it a task of its own before React draws the page.
 */
export function storefrontTheme(): Theme {
  if (!built) {
    built = createLoomwrightTheme();
    delete (built.colorSchemes as Partial<typeof built.colorSchemes>).dark;
  }
  return built;
}
