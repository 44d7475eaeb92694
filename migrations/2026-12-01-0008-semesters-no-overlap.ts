import { sql, type Kysely } from "kysely";

// Semesters never share time: the ledger's per-semester balances count on it. An exclusion
// constraint on the half-open range holds however many app instances save at once (the
// service checks first, for a message naming the semester in the way). A lone range column
// needs no btree_gist; the foundation enabled it anyway, for blocks_no_overlap. Semesters
// that already overlap stop the migration with their codes, rather than a bare 23P01.
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    DO $$
    DECLARE clashes text;
    BEGIN
      SELECT string_agg(a.code || ' and ' || b.code, ', ' ORDER BY a.starts_at, b.starts_at) INTO clashes
        FROM semesters a JOIN semesters b ON a.id < b.id
        AND tstzrange(a.starts_at, a.ends_at, '[)') && tstzrange(b.starts_at, b.ends_at, '[)');
      IF clashes IS NOT NULL THEN
        RAISE EXCEPTION 'These semesters overlap: %. Change their dates so they do not, then migrate again.', clashes;
      END IF;
    END $$;
    ALTER TABLE semesters ADD CONSTRAINT semesters_no_overlap
      EXCLUDE USING gist (tstzrange(starts_at, ends_at, '[)') WITH &&);
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`ALTER TABLE semesters DROP CONSTRAINT IF EXISTS semesters_no_overlap`.execute(db);
}
