import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: { name: 'shared', root: __dirname, include: ['src/**/*.spec.ts'], environment: 'node', passWithNoTests: true, testTimeout: 60_000 },
});
