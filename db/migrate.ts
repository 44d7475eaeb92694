/**
 * Runs the Kysely migrations in migrations/. Used by scripts/migrate.ts (the npm script)
 * and by the integration tests, which migrate a fresh database up and down.
 */
import { Migrator, NO_MIGRATIONS, type MigrationResultSet } from "kysely";
import { migrations } from "../migrations/index";
import type { Db } from "./index";

export function createMigrator(db: Db): Migrator {
  return new Migrator({ db, provider: { getMigrations: async () => migrations } });
}

function unwrap(result: MigrationResultSet): MigrationResultSet {
  if (result.error) throw result.error;
  return result;
}

export async function migrateToLatest(db: Db): Promise<MigrationResultSet> {
  return unwrap(await createMigrator(db).migrateToLatest());
}

export async function migrateDownOne(db: Db): Promise<MigrationResultSet> {
  return unwrap(await createMigrator(db).migrateDown());
}

export async function migrateToZero(db: Db): Promise<MigrationResultSet> {
  return unwrap(await createMigrator(db).migrateTo(NO_MIGRATIONS));
}
