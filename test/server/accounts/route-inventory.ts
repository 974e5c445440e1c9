import type { Express } from 'express';

/** The parts of Express 5's router layers (package `router` 2.x) the inventory reads. */
interface LayerLike {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
}

function joinPath(prefix: string, path: string): string {
  const joined = `${prefix}${path === '/' ? '' : path}`;
  return joined === '' ? '/' : joined.replace(/\/+$/, '') || '/';
}

function walk(stack: LayerLike[], prefix: string, out: Set<string>): void {
  for (const layer of stack) {
    if (layer.route) {
      const path = joinPath(prefix, String(layer.route.path));
      for (const [method, on] of Object.entries(layer.route.methods)) {
        if (on && method !== '_all') out.add(`${method.toUpperCase()} ${path}`);
      }
    } else if (layer.handle?.stack) {
      const raw = typeof layer.rawPath === 'string' ? layer.rawPath : '/';
      walk(layer.handle.stack, joinPath(prefix, raw), out);
    }
  }
}

/**
 * Every route the application really serves, as `METHOD /path` with Express parameter syntax,
 * read from the router stack (nested routers included). Only `/api` routes are returned.
 */
export function apiRoutes(app: Express): string[] {
  const out = new Set<string>();
  walk((app.router as unknown as { stack: LayerLike[] }).stack, '', out);
  return [...out].filter((r) => r.split(' ')[1]?.startsWith('/api')).sort();
}
