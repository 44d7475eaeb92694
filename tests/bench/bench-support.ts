/**
 * What the benchmarks share: nearest-rank percentiles, and a throwaway database of their
 * own (created empty, named after the process, dropped afterwards).
 */
import pg from "pg";

/** The nearest-rank percentile of an ascending array (NaN when it is empty). */
export function percentile(sorted: number[], p: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil((p / 100) * sorted.length) - 1))] ?? NaN;
}

async function admin(url: string, query: string): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(query);
  } finally {
    await client.end();
  }
}

/**
 * A fresh empty database on the project's cluster (PG_ADMIN_URL), with DATABASE_URL
 * pointing at it before any app module is imported; `drop()` removes it.
 */
export async function throwawayDatabase(prefix: string): Promise<{ url: string; drop: () => Promise<void> }> {
  const adminUrl = process.env.PG_ADMIN_URL;
  if (!adminUrl) throw new Error("PG_ADMIN_URL is not set: `source scripts/lib.sh && pg_start && export PG_ADMIN_URL` first");
  const name = `${prefix}_${process.pid}`;
  await admin(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
  await admin(adminUrl, `CREATE DATABASE ${name}`);
  const url = new URL(adminUrl);
  url.pathname = `/${name}`;
  process.env.DATABASE_URL = url.toString();
  return { url: url.toString(), drop: () => admin(adminUrl, `DROP DATABASE IF EXISTS ${name} WITH (FORCE)`) };
}
