import type { Express } from 'express';

type Layer = {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
  rawPath?: unknown;
};

/**
 * Every `METHOD /path` the Express app answers, found by walking its router stack (Express 5 keeps
 * each layer's `rawPath`). A router mounted on a pattern we cannot read is an error, not a skip.
 */
export function listRoutes(app: Express): string[] {
  const found: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (!on) continue;
          for (const path of paths) found.push(`${method === '_all' ? 'ALL' : method.toUpperCase()} ${prefix}${path}`);
        }
      } else if (layer.handle?.stack) {
        if (layer.rawPath !== undefined && typeof layer.rawPath !== 'string') {
          throw new Error(`A router is mounted on a non-string path (${String(layer.rawPath)}); list its routes by hand.`);
        }
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...new Set(found)].sort();
}
