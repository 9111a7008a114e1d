/**
 * The vitest settings both apps' component tests share (jsdom, the shared set-up file), read by
 * each app's vite.config.ts as its `test` block. Never imported by app code.
 */
export const componentTests = (name: string, root: string) => ({
  name,
  root,
  environment: 'jsdom' as const,
  include: ['src/**/*.spec.{ts,tsx}'],
  setupFiles: ['../shared/src/ui/test-setup.ts'],
  passWithNoTests: true,
  // Component tests share two cores with the API tests in one vitest run; Testing Library's
  // findBy waits and a jsdom render of a whole page can pass vitest's default 5 s there.
  testTimeout: 20_000,
});
