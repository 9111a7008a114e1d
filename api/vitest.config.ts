import path from 'node:path';
import swc from 'unplugin-swc';
import { defineConfig } from 'vitest/config';

// SWC compiles the API's TypeScript in tests so Nest's decorator metadata (constructor injection)
// is emitted exactly as tsc emits it for the build.
export default defineConfig({
  plugins: [swc.vite({ module: { type: 'es6' } })],
  resolve: {
    alias: [
      // The answer schemas are a subpath of their own (kept out of the apps' bundles): see shared/src/response-schemas.ts.
      { find: '@loomwright/shared/dist/response-schemas', replacement: path.resolve(__dirname, '../shared/src/response-schemas.ts') },
      { find: '@loomwright/shared', replacement: path.resolve(__dirname, '../shared/src/index.ts') },
    ],
  },
  test: {
    name: 'api',
    root: __dirname,
    include: ['src/**/*.spec.ts', 'test/**/*.spec.ts', 'fakes/**/*.spec.ts'],
    environment: 'node',
    // Compile-time tests (*.test-d.ts): vitest runs tsc over them and their imports, and fails on a
    // type error or an `@ts-expect-error` that no longer has an error to expect.
    typecheck: { enabled: true, include: ['src/**/*.test-d.ts'], tsconfig: './tsconfig.json' },
    testTimeout: 30_000,
    hookTimeout: 60_000,
  },
});
