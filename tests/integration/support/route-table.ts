// The app's own route table, read from the Express router, so a test over "every route" cannot
// miss one that is added later.
import type { Express } from 'express';

type Layer = { rawPath?: unknown; route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };

export type RouteEntry = { method: string; path: string };

/** Every route as `{ method, path }` with its full path (mount points included), e.g. `POST /api/log/:id/amendments`. */
export function routeTable(app: Express): RouteEntry[] {
  const found: RouteEntry[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method !== '_all') found.push({ method: method.toUpperCase(), path: prefix + (layer.route.path === '/' ? '' : layer.route.path) || '/' });
        }
      } else if (layer.handle?.stack) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return found;
}

/** The routes that change something: every method but GET (and HEAD). */
export const writeRoutesOf = (app: Express) => routeTable(app).filter((r) => r.method !== 'GET' && r.method !== 'HEAD');

/** Fills `:name` parameters from `ids` (by the segment before `:id`, or by the parameter's name). */
export function fillPath(path: string, ids: Record<string, string | number>, fallback: string | number = 987_654_321): string {
  const segments = path.split('/');
  return segments
    .map((segment, i) => {
      if (!segment.startsWith(':')) return segment;
      const name = segment.slice(1);
      const byOwner = name === 'id' ? ids[`${segments[i - 1]}/:id`] : undefined;
      return String(byOwner ?? ids[name] ?? fallback);
    })
    .join('/');
}
