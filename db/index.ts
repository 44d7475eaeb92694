/**
 * The one Kysely instance. Created on first use so that importing this module (as
 * `next build` does) never opens a connection or demands DATABASE_URL.
 */
import { Kysely, PostgresDialect, type Transaction } from "kysely";
import pg from "pg";
import type { Database } from "./types";

export type Db = Kysely<Database>;
export type Trx = Transaction<Database>;

// numeric and bigint arrive as strings by default; our numerics are small (coordinates,
// hours, magnitudes) and safe as JS numbers.
pg.types.setTypeParser(pg.types.builtins.NUMERIC, (v) => Number(v));
pg.types.setTypeParser(pg.types.builtins.INT8, (v) => Number(v));

// Kept on globalThis so that dev-mode hot reloads reuse one pool instead of leaking them.
const globalForDb = globalThis as unknown as { nightbreakDb?: Db; nightbreakPool?: pg.Pool };

export function createPool(connectionString: string, max = 10): pg.Pool {
  const pool = new pg.Pool({ connectionString, max, connectionTimeoutMillis: 5_000 });
  // A client that loses its server (a restart, a failover) must not crash the process.
  // An idle one reports it through the pool; one checked out between two queries (inside
  // a transaction, say) reports it on itself, where pg-pool does not listen. Either way
  // the client is done: its next query fails, and the pool drops it when it comes back.
  // tests/integration/faults/postgres-restart.test.ts restarts a server under load.
  pool.on("error", () => undefined);
  pool.on("connect", (client) => client.on("error", () => undefined));
  return pool;
}

export function createDb(connectionString: string, max = 10): Db {
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool: createPool(connectionString, max) }) });
}

/** The app's pool, shared by Kysely and the few libraries that need a raw pg client. */
export function getPool(): pg.Pool {
  if (!globalForDb.nightbreakPool) {
    const url = process.env.DATABASE_URL;
    if (!url) throw new Error("DATABASE_URL is not set: start the database with `npm run db:up`");
    globalForDb.nightbreakPool = createPool(url, Number(process.env.DATABASE_POOL_SIZE ?? 10));
  }
  return globalForDb.nightbreakPool;
}

export function getDb(): Db {
  globalForDb.nightbreakDb ??= new Kysely<Database>({ dialect: new PostgresDialect({ pool: getPool() }) });
  return globalForDb.nightbreakDb;
}
