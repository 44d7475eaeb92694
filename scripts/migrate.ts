// `npm run db:migrate` (up to latest) or `npm run db:migrate -- down` (one step down).
import { createDb } from "../db/index";
import { migrateDownOne, migrateToLatest } from "../db/migrate";

const direction = process.argv[2] ?? "up";
if (!process.env.DATABASE_URL) {
  console.error("DATABASE_URL is not set (scripts/pg.sh prints it)");
  process.exit(2);
}
const db = createDb(process.env.DATABASE_URL, 1);
try {
  const result = direction === "down" ? await migrateDownOne(db) : await migrateToLatest(db);
  for (const r of result.results ?? []) console.log(`migration ${r.direction.toLowerCase()}: ${r.migrationName} (${r.status})`);
  if (!result.results?.length) console.log("migrations: nothing to do");
} catch (error) {
  console.error("migration failed:", error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
