import '@fontsource/manrope/latin-400.css';
import '@fontsource/manrope/latin-600.css';
import '@fontsource/manrope/latin-700.css';
import { startTransition, StrictMode } from 'react';
import { createRoot, hydrateRoot } from 'react-dom/client';
import { hydration } from 'src/app/hydration';
import { AppProviders } from 'src/app/providers';
import { AppRouter } from 'src/app/router';
import { storefrontTheme } from 'src/theme';

const container = document.getElementById('root')!;
const app = (
  <StrictMode>
    <AppProviders>
      <AppRouter />
    </AppProviders>
  </StrictMode>
);

// home.html and configure.html hold their page as the build prerendered it (`src/prerender.tsx`),
// marked with its path: React takes that markup over instead of drawing it again. Any other page
// (index.html, whose prerendered layout has a loading line where the page goes) is drawn afresh over
// the same-looking markup.
// Hydration in a transition is rendered in slices that yield to the browser (React Router's own
// client entry hydrates the same way), instead of one long task.
// configure.html holds the Surface step's first screen (where every new board starts): a link to
// another step (even a misspelt one, which shows the Surface step) is drawn afresh, like any other page.
const step = new URLSearchParams(window.location.search).get('step');
const samePage =
  container.dataset.prerendered === window.location.pathname && (window.location.pathname !== '/configure' || !step || step === 'surface');

// Three tasks, not one: evaluating this script's modules, building the theme, and starting React
// each hold the main thread for a while on a phone; between them the browser can paint and answer a tap.
setTimeout(() => {
  storefrontTheme();
  setTimeout(() => {
    if (samePage) {
      hydration.pending = true;
      startTransition(() => void hydrateRoot(container, app));
    } else createRoot(container).render(app);
  });
});
