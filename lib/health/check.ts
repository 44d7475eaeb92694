import { sql } from "kysely";
import type { Db } from "@/db/index";

export interface Health {
  status: "ok" | "degraded";
  app: { version: string; uptimeSeconds: number };
  database: { ok: boolean; latencyMs: number | null; migration: string | null; error?: string };
}

export async function checkHealth(db: Db): Promise<Health> {
  const started = performance.now();
  const app = { version: process.env.npm_package_version ?? "0.1.0", uptimeSeconds: Math.round(process.uptime()) };
  try {
    const row = await sql<{ name: string | null }>`
      select (select name from kysely_migration order by name desc limit 1) as name`.execute(db);
    const latencyMs = Math.round((performance.now() - started) * 10) / 10;
    return { status: "ok", app, database: { ok: true, latencyMs, migration: row.rows[0]?.name ?? null } };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    // The raw driver message can name hosts and ports: log it, answer with a plain sentence.
    console.error("health check: database unavailable:", message);
    return { status: "degraded", app, database: { ok: false, latencyMs: null, migration: null, error: "The database did not answer." } };
  }
}
