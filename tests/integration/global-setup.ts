/**
 * Gives the integration tests a fresh, migrated PostgreSQL database of their own for
 * this run (the real server started by scripts/test.sh), and drops it afterwards.
 */
import type { TestProject } from "vitest/node";
import pg from "pg";
import { createDb } from "../../db/index";
import { migrateToLatest } from "../../db/migrate";

declare module "vitest" {
  export interface ProvidedContext {
    databaseUrl: string;
    adminUrl: string;
  }
}

function adminUrl(): string {
  const url = process.env.PG_ADMIN_URL ?? process.env.DATABASE_URL;
  if (!url) throw new Error("Integration tests need PG_ADMIN_URL (run them through `npm test`, which starts PostgreSQL)");
  return url;
}

export function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

export default async function setup(project: TestProject) {
  const admin = adminUrl();
  const name = `nightbreak_it_${process.pid}`;
  const client = new pg.Client({ connectionString: admin });
  await client.connect();
  await client.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  await client.query(`CREATE DATABASE ${name}`);
  await client.end();

  const url = withDatabase(admin, name);
  const db = createDb(url, 1);
  await migrateToLatest(db);
  await db.destroy();

  project.provide("databaseUrl", url);
  project.provide("adminUrl", admin);

  return async () => {
    const c = new pg.Client({ connectionString: admin });
    await c.connect();
    await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
    await c.end();
  };
}
