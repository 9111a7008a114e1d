import path from 'node:path';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';
import { componentTests } from '../shared/src/ui/component-tests.config';

const apiTarget = process.env.API_URL ?? 'http://localhost:3000';

export default defineConfig({
  plugins: [react()],
  base: '/backoffice/',
  resolve: {
    alias: {
      src: path.resolve(__dirname, 'src'),
      '@loomwright/shared/ui/testing': path.resolve(__dirname, '../shared/src/ui/testing.tsx'),
      '@loomwright/shared/ui': path.resolve(__dirname, '../shared/src/ui/index.ts'),
      '@loomwright/shared/joy-theme': path.resolve(__dirname, '../shared/src/joy-theme.ts'),
      '@loomwright/shared': path.resolve(__dirname, '../shared/src/index.ts'),
    },
  },
  server: { port: 5174, proxy: { '/api': apiTarget } },
  build: { outDir: 'dist', sourcemap: false },
  test: componentTests('backoffice', __dirname),
});
