/**
 * State shared by every copy of a module in this process. Next loads route handlers and
 * pages (with their server actions) in separate module graphs, so a module-level Map in
 * a cache would exist twice: a server action forgetting it would leave the route's copy
 * stale. Keeping the state on globalThis under a registered symbol gives both one copy.
 */
export function processShared<T>(name: string, create: () => T): T {
  const store = globalThis as unknown as Record<symbol, T | undefined>;
  const key = Symbol.for(`nightbreak.${name}`);
  store[key] ??= create();
  return store[key];
}
