/**
 * PostgreSQL restarted under load: the app's own database module (db/index.ts — the one
 * pool behind getDb) and the health route keep running in this process while the server
 * goes away and comes back, twice: a fast shutdown (maintenance) and an immediate one (a
 * crash). While it is down, /api/health answers 503 and every query fails with an error,
 * none hangs; once it is back, health is 200 and every query succeeds on the same pool,
 * and each write that was reported committed is there, whole.
 *
 * It uses a throwaway cluster of its own (in a temp folder, on a free port, with the same
 * binaries as scripts/lib.sh), so stopping it disturbs no other test. As root the server
 * runs as the `postgres` user, as lib.sh does. An idle pooled connection that loses its
 * server emits an error; without the pool's error handler that would crash the process,
 * and Vitest would report it as an unhandled error.
 */
import { execFile } from "node:child_process";
import { existsSync, readdirSync } from "node:fs";
import { mkdtemp, rm } from "node:fs/promises";
import { createServer } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { GET as healthRoute } from "@/app/api/health/route";
import { getDb, getPool, type Db } from "@/db/index";
import { migrateToLatest } from "@/db/migrate";
import type { Health } from "@/lib/health/check";
import { insertUser, listUsers } from "@/lib/users/queries";

const run = promisify(execFile);

function postgresBin(): string | null {
  const root = "/usr/lib/postgresql";
  if (!existsSync(root)) return null;
  const versions = readdirSync(root).filter((v) => existsSync(path.join(root, v, "bin", "pg_ctl")));
  const newest = versions.sort((a, b) => Number(a) - Number(b)).at(-1);
  return newest ? path.join(root, newest, "bin") : null;
}

const BIN = postgresBin();
const asRoot = process.getuid?.() === 0;

/** The server refuses to run as root: as root, run its tools as `postgres` (as scripts/lib.sh does). */
function pgTool(tool: string, args: string[]) {
  const file = path.join(BIN ?? "", tool);
  return asRoot ? run("runuser", ["-u", "postgres", "--", file, ...args]) : run(file, args);
}

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const address = server.address();
      server.close(() => (typeof address === "object" && address ? resolve(address.port) : reject(new Error("no port"))));
    });
  });
}

let folder = "";
let dataDir = "";
let port = 0;
let started = false;

async function startServer(): Promise<void> {
  const options = `-c listen_addresses=127.0.0.1 -p ${port} -c unix_socket_directories='' -c max_connections=40 -c fsync=off`;
  await pgTool("pg_ctl", ["-D", dataDir, "-l", path.join(folder, "server.log"), "-o", options, "-w", "-t", "60", "start"]);
  started = true;
}

async function stopServer(mode: "fast" | "immediate"): Promise<void> {
  await pgTool("pg_ctl", ["-D", dataDir, "-m", mode, "-w", "-t", "60", "stop"]);
  started = false;
}

/** One operation of the load: whether it worked, and when it started and ended. */
interface Outcome {
  ok: boolean;
  error?: string;
  startedAt: number;
  endedAt: number;
}

const HANG_MS = 20_000;

function withWatchdog<T>(work: Promise<T>): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const watchdog = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`HANG: no answer within ${HANG_MS} ms`)), HANG_MS);
  });
  return Promise.race([work, watchdog]).finally(() => clearTimeout(timer));
}

/** Readers and writers through the app's own query functions and pool, until stopped. */
function startLoad(db: Db, workers: number) {
  const outcomes: Outcome[] = [];
  const committed: string[] = [];
  let stopping = false;
  let counter = 0;
  const loop = async (worker: number) => {
    while (!stopping) {
      const write = (counter += 1) % 2 === 0;
      const email = `load-${worker}-${counter}@restart.test`;
      const startedAt = Date.now();
      try {
        if (write) {
          await withWatchdog(db.transaction().execute((trx) => insertUser(trx, { email, name: `Load ${counter}`, passwordHash: "not-a-real-hash", roles: ["observer"] })));
          committed.push(email);
        } else {
          await withWatchdog(listUsers(db));
        }
        outcomes.push({ ok: true, startedAt, endedAt: Date.now() });
      } catch (error) {
        outcomes.push({ ok: false, error: error instanceof Error ? error.message : `not an Error: ${String(error)}`, startedAt, endedAt: Date.now() });
      }
      await new Promise((r) => setTimeout(r, 25));
    }
  };
  const loops = Array.from({ length: workers }, (_, i) => loop(i));
  return {
    outcomes,
    committed,
    /** Operations begun after `t`. */
    since: (t: number) => outcomes.filter((o) => o.startedAt > t),
    async stop() {
      stopping = true;
      await Promise.all(loops);
    },
  };
}

async function waitFor(what: string, check: () => boolean | Promise<boolean>, timeoutMs = 30_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

async function health(): Promise<{ status: number; body: Health; text: string }> {
  const response = await healthRoute();
  const text = await response.text();
  return { status: response.status, body: JSON.parse(text) as Health, text };
}

describe.skipIf(!BIN)("PostgreSQL restarted under load", () => {
  beforeAll(async () => {
    folder = await mkdtemp(path.join(tmpdir(), "nightbreak-pg-restart-"));
    dataDir = path.join(folder, "data");
    if (asRoot) await run("chown", ["postgres:postgres", folder]);
    await pgTool("initdb", ["-D", dataDir, "-U", "postgres", "--auth=trust", "-E", "UTF8", "--locale=C.UTF-8", "--no-sync"]);
    port = await freePort();
    await startServer();
    // Before anything touches getDb(): the app's database module is this cluster's.
    process.env.DATABASE_URL = `postgres://postgres@127.0.0.1:${port}/postgres`;
    await migrateToLatest(getDb());
  }, 120_000);

  afterAll(async () => {
    await getDb()
      .destroy()
      .catch(() => undefined);
    if (started) await stopServer("immediate").catch(() => undefined);
    if (folder) await rm(folder, { recursive: true, force: true });
  });

  it("answers 503 while it is down, never hangs, and recovers on the same pool once it is back", async () => {
    const pool = getPool();
    const db = getDb();
    const logged = vi.spyOn(console, "error").mockImplementation(() => undefined);

    const before = await health();
    expect(before.status).toBe(200);
    expect(before.body).toMatchObject({ status: "ok", database: { ok: true } });

    const load = startLoad(db, 6);
    try {
      await waitFor("the load to get going", () => load.outcomes.filter((o) => o.ok).length >= 20);

      for (const mode of ["fast", "immediate"] as const) {
        const stoppedAt = Date.now();
        await stopServer(mode);

        const down = await health();
        expect(down.status, mode).toBe(503);
        expect(down.body).toMatchObject({ status: "degraded", database: { ok: false, latencyMs: null, error: "The database did not answer." } });
        // The driver's message (host, port) goes to the log, not to the public answer.
        expect(down.text).not.toContain(String(port));
        expect(logged.mock.calls.some((args) => String(args[0]).startsWith("health check: database unavailable"))).toBe(true);
        await waitFor(`queries to fail after the ${mode} stop`, () => load.outcomes.filter((o) => o.endedAt > stoppedAt && !o.ok).length >= 10);

        const restartedAt = Date.now();
        await startServer();
        await waitFor(`health to come back after the ${mode} stop`, async () => (await health()).status === 200);
        const recoveredAt = Date.now();
        await waitFor(`queries to succeed after the ${mode} restart`, () => load.since(recoveredAt).filter((o) => o.ok).length >= 20);

        const whileDown = load.outcomes.filter((o) => o.endedAt > stoppedAt && o.endedAt <= restartedAt && !o.ok);
        expect(whileDown.length).toBeGreaterThan(0);
        for (const failure of whileDown) expect(failure.error, mode).toMatch(/\S/);
        expect(whileDown.filter((o) => o.error?.startsWith("HANG") || o.error?.startsWith("not an Error"))).toEqual([]);
        // Recovered means recovered: no stale connection fails a query afterwards.
        expect(load.since(recoveredAt).filter((o) => !o.ok)).toEqual([]);
      }
    } finally {
      await load.stop();
      logged.mockRestore();
    }

    // The same pool and the same Kysely instance throughout: nothing was restarted.
    expect(getPool()).toBe(pool);
    expect(getDb()).toBe(db);
    expect(pool.waitingCount).toBe(0);
    expect((await health()).body.status).toBe("ok");

    // Every write reported committed is there, and whole (user and role together). A write
    // whose COMMIT reached the server just before it went down may be there too, unreported.
    const created = await db
      .selectFrom("users as u")
      .leftJoin("user_roles as r", "r.user_id", "u.id")
      .select(["u.email", "r.role"])
      .where("u.email", "like", "load-%@restart.test")
      .execute();
    expect(created.filter((c) => c.role !== "observer")).toEqual([]);
    expect(created.map((c) => c.email)).toEqual(expect.arrayContaining(load.committed));
    expect(load.committed.length).toBeGreaterThan(10);
  }, 120_000);
});
