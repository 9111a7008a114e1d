import type { Express } from 'express';
import type { TestApp } from './test-app';

/** "METHOD /path" for every route on the Express router (Express 5 keeps them in app.router.stack). */
export function registeredRoutes(t: TestApp): string[] {
  const express = t.app.getHttpAdapter().getInstance() as Express & {
    router: { stack: Array<{ route?: { path: string; methods: Record<string, boolean> } }> };
  };
  const keys = new Set<string>();
  for (const layer of express.router.stack) {
    if (!layer.route) continue;
    for (const [method, on] of Object.entries(layer.route.methods))
      if (on && method !== '_all') keys.add(`${method.toUpperCase()} ${layer.route.path}`);
  }
  return [...keys].sort();
}
