import express, { type Express } from 'express';

export interface MountedRoute {
  method: string;
  path: string;
  /** The route's own handlers for this method, in order (middleware given to the router's `use` is not here). */
  handlers: unknown[];
}

/**
 * Builds the app while recording every `use` and `route` call on Express routers, then lists each mounted route
 * with its full path. Express 5 keeps no path strings on its layers, so recording the calls is the reliable way
 * to walk what is really mounted.
 */
export function buildAndWalk(build: () => Express): { app: Express; routes: MountedRoute[] } {
    // Each router function's prototype is its own Router instance, whose prototype holds the shared methods.
  const proto = Object.getPrototypeOf(Object.getPrototypeOf(express.Router())) as Record<string, (...args: unknown[]) => unknown>;
  const origUse = proto.use;
  const origRoute = proto.route;
  const mounts: Array<{ parent: unknown; path: string; child: unknown }> = [];
  type Route = { methods: Record<string, boolean>; stack: Array<{ method?: string; handle: unknown }> };
  const routes: Array<{ router: unknown; path: string; route: Route }> = [];
  proto.use = function (this: unknown, ...args: unknown[]) {
    const path = typeof args[0] === 'string' ? args[0] : '/';
    for (const fn of args.flat()) {
      if (typeof fn === 'function' && Object.prototype.isPrototypeOf.call(proto, fn)) mounts.push({ parent: this, path, child: fn });
    }
    return origUse.apply(this, args);
  };
  proto.route = function (this: unknown, path: unknown) {
    const route = origRoute.call(this, path) as Route;
    routes.push({ router: this, path: String(path), route });
    return route;
  };
  let app: Express;
  try {
    app = build();
  } finally {
    proto.use = origUse;
    proto.route = origRoute;
  }
  const out: MountedRoute[] = [];
  const join = (a: string, b: string) => (a + (b === '/' ? '' : b)) || '/';
  const walk = (router: unknown, prefix: string) => {
    for (const r of routes.filter((x) => x.router === router)) {
      for (const method of Object.keys(r.route.methods).filter((m) => m !== '_all')) {
        out.push({ method, path: join(prefix, r.path), handlers: r.route.stack.filter((l) => l.method === method).map((l) => l.handle) });
      }
    }
    for (const m of mounts.filter((x) => x.parent === router)) walk(m.child, join(prefix, m.path));
  };
  walk((app as unknown as { router: unknown }).router, '');
  return { app, routes: out };
}
