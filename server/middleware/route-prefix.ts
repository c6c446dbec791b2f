import type { RequestHandler, Router } from 'express';

// Every feature router is mounted on the API without a path (its routes name their whole path), so Express walks
// every route of every router before it reaches the one that answers: a signed check was matched against the
// routes of six routers first. A router whose stack holds only routes with plain paths is skipped in one lookup
// when the request's first path segment is none of its routes'.

interface StackLayer {
  route?: { path?: unknown };
}

const firstSegment = (path: string) => {
  const end = path.indexOf('/', 1);
  return (end === -1 ? path : path.slice(0, end)).toLowerCase();
};

/**
 * The first path segments of a router's routes ("/checks"), or null when the router must see every request: it has
 * a middleware of its own, or a route path that is not a plain string or starts with a parameter.
 */
export function routePrefixes(router: Router): Set<string> | null {
  const prefixes = new Set<string>();
  for (const layer of router.stack as StackLayer[]) {
    const path = layer.route?.path;
    // A route may name several paths (router.get(['/checks/:id', ...])).
    for (const one of Array.isArray(path) ? (path as unknown[]) : [path]) {
      if (typeof one !== 'string' || !one.startsWith('/') || /^\/[:*({]/.test(one)) return null;
      prefixes.add(firstSegment(one));
    }
  }
  return prefixes;
}

/** The router, run only for requests whose first path segment one of its routes starts with. */
export function onlyForItsRoutes(router: Router): RequestHandler {
  const prefixes = routePrefixes(router);
  if (!prefixes) return router;
  const handler: RequestHandler = (req, res, next) => {
    if (prefixes.has(firstSegment(req.path))) router(req, res, next);
    else next();
  };
  // The router's stack stays readable through the wrapper, as a mounted router's is: tests that list every API
  // route (hostile input, the temporary PIN) walk it.
  return Object.assign(handler, { stack: router.stack });
}
