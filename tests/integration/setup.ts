import { AsyncLocalStorage } from "node:async_hooks";
import { inject } from "vitest";

// db/index.ts reads DATABASE_URL on first use: point it at this run's fresh database.
process.env.DATABASE_URL = inject("databaseUrl");

// Next's request APIs (headers(), cookies()) keep their state in AsyncLocalStorage, which
// `next start` puts on globalThis before loading any app code; so must we, before any test
// file imports next (tests/integration/request-scope.ts runs code inside such a scope).
(globalThis as { AsyncLocalStorage?: typeof AsyncLocalStorage }).AsyncLocalStorage ??= AsyncLocalStorage;
