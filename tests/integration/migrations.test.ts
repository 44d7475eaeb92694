import { sql } from "kysely";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { inject } from "vitest";
import { createDb, type Db } from "@/db/index";
import { migrateToLatest, migrateToZero } from "@/db/migrate";

// A database of its own: the shared test database must stay migrated for the other files.
const name = `nightbreak_mig_${process.pid}`;
let db: Db;

async function admin(query: string) {
  const client = new pg.Client({ connectionString: inject("adminUrl") });
  await client.connect();
  await client.query(query);
  await client.end();
}

async function tableNames(): Promise<string[]> {
  const { rows } = await sql<{ tablename: string }>`select tablename from pg_tables where schemaname = 'public' order by 1`.execute(db);
  return rows.map((r) => r.tablename).filter((t) => !t.startsWith("kysely_"));
}

beforeAll(async () => {
  await admin(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  await admin(`CREATE DATABASE ${name}`);
  const url = new URL(inject("adminUrl"));
  url.pathname = `/${name}`;
  db = createDb(url.toString(), 1);
});

afterAll(async () => {
  await db.destroy();
  await admin(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
});

describe("migrations", () => {
  it("go up on a fresh database, down to nothing, and up again", async () => {
    await migrateToLatest(db);
    const up = await tableNames();
    expect(up).toEqual(expect.arrayContaining(["users", "user_roles", "sites", "telescopes", "instruments", "programs", "blocks", "audit_log", "api_tokens"]));

    await migrateToZero(db);
    expect(await tableNames()).toEqual([]);

    const again = await migrateToLatest(db);
    expect(again.results?.every((r) => r.status === "Success")).toBe(true);
    expect(await tableNames()).toEqual(up);
  });
});
