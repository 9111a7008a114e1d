import { defineConfig } from 'vitest/config';

// One run covers every workspace's unit and API tests; Playwright journeys run separately in e2e/.
export default defineConfig({
  test: { projects: ['shared', 'api', 'storefront', 'backoffice'] },
});
