interface RouteLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: RouteLayer[] };
}

/** Every route an Express app registers, through routers mounted without a path: upper-case method and path. */
export function registeredRoutes(app: unknown): { method: string; path: string }[] {
  const found: { method: string; path: string }[] = [];
  const walk = (stack: RouteLayer[]) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          if (method !== '_all') found.push({ method: method.toUpperCase(), path: layer.route.path });
        }
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack);
      }
    }
  };
  walk((app as { router: { stack: RouteLayer[] } }).router.stack);
  return found;
}
