/** Every route registered in an Express 5 app, as `METHOD /full/path` (mount paths joined). */
import type { Express } from 'express';
import { appInstances } from './test-app.js';

interface LayerLike {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: LayerLike[] };
}

function join(prefix: string, p: string): string {
  const joined = `${prefix}/${p}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function walk(stack: LayerLike[], prefix: string, out: string[]): void {
  for (const layer of stack) {
    if (layer.route) {
      const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
      for (const p of paths) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== '_all') out.push(`${method.toUpperCase()} ${join(prefix, String(p))}`);
        }
      }
    } else if (layer.handle?.stack) {
      const mount = typeof layer.rawPath === 'string' ? layer.rawPath : '';
      walk(layer.handle.stack, join(prefix, mount), out);
    }
  }
}

export function listRoutes(app: Express): string[] {
  // a test app on the engines is a front over two instances: list the first's routes
  const router = (appInstances(app)[0] as unknown as { router: { stack: LayerLike[] } }).router;
  const out: string[] = [];
  walk(router.stack, '', out);
  return [...new Set(out)].sort();
}
