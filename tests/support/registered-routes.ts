/**
 * Lists every route the Express app registers, as "METHOD /full/path/:param", by walking
 * the router stack (Express 5: app.router.stack; a mounted router is a layer whose handle
 * has its own stack, mounted at layer.rawPath). The route-access table is checked against
 * this list, so a route added later without a row in the table fails the suite.
 */
import { Sequelize } from 'sequelize';
import type express from 'express';
import { createApp, type AppServices } from '../../server/app';
import type { AppConfig } from '../../server/config/config';

interface Layer {
  route?: { path: string | string[]; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
  rawPath?: unknown;
}

function join(prefix: string, p: string): string {
  const joined = `${prefix}/${p}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

function walk(stack: Layer[], prefix: string, out: Set<string>): void {
  for (const layer of stack) {
    if (layer.route) {
      for (const p of ([] as string[]).concat(layer.route.path)) {
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on) out.add(`${method === '_all' ? 'ALL' : method.toUpperCase()} ${join(prefix, p)}`);
        }
      }
    } else if (layer.handle?.stack) {
      const raw = layer.rawPath;
      if (typeof raw !== 'string') throw new Error(`a router is mounted at ${String(raw)}; only string mount paths can be listed`);
      walk(layer.handle.stack, join(prefix, raw), out);
    }
  }
}

export function routesOf(app: express.Express): string[] {
  const router = (app as unknown as { router: { stack: Layer[] } }).router;
  const out = new Set<string>();
  walk(router.stack, '', out);
  return [...out].sort();
}

/**
 * Builds the app exactly as the server does (createApp) with the same configuration and
 * lists its routes. Building routes touches no database and calls no service, so an
 * unconnected Sequelize and inert services are enough (whatever services createApp gains
 * later); the session store's expiry timer is stopped at once.
 */
export function registeredRoutes(config: AppConfig): string[] {
  const sequelize = new Sequelize({ dialect: 'mariadb', logging: false });
  // Any property of an inert service is the inert service again; calling it does nothing.
  const inert: unknown = new Proxy(() => undefined, { get: (_t, key) => (key === 'then' ? undefined : inert) });
  const services = new Proxy({}, { get: () => inert }) as AppServices;
  const quiet = { info: () => {}, warn: () => {}, error: () => {} };
  const handle = createApp(config, sequelize, quiet, services);
  try {
    return routesOf(handle.app);
  } finally {
    handle.close();
    void sequelize.close();
  }
}
