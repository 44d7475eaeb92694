import type { Db } from "@/db/index";
import type { BlockKind } from "@/db/types";

/** A block with everything an export or a calendar feed prints about it. */
export interface ExportBlock {
  id: string;
  kind: BlockKind;
  startsAt: Date;
  endsAt: Date;
  updatedAt: Date;
  notes: string;
  telescope: { code: string; name: string };
  site: { name: string; timeZone: string };
  program: { code: string; title: string };
  pi: { name: string; email: string };
  observer: { name: string; email: string } | null;
  instrument: { code: string; name: string } | null;
}

export interface ExportFilter {
  telescopeId?: string;
  programId?: string;
  observerUserId?: string;
  /** Blocks that end after `from` and start before `to`. */
  from?: Date;
  to?: Date;
}

/** A full semester of three telescopes is a few thousand blocks; this is a safety net. */
export const MAX_EXPORT_BLOCKS = 20_000;

export async function listBlocksForExport(db: Db, filter: ExportFilter): Promise<ExportBlock[]> {
  let q = db
    .selectFrom("blocks as b")
    .innerJoin("telescopes as t", "t.id", "b.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .innerJoin("users as pi", "pi.id", "p.pi_user_id")
    .leftJoin("users as o", "o.id", "b.observer_user_id")
    .leftJoin("instruments as i", "i.id", "b.instrument_id")
    .select([
      "b.id",
      "b.kind",
      "b.starts_at",
      "b.ends_at",
      "b.updated_at",
      "b.notes",
      "t.code as telescope_code",
      "t.name as telescope_name",
      "s.name as site_name",
      "s.time_zone",
      "p.code as program_code",
      "p.title as program_title",
      "pi.name as pi_name",
      "pi.email as pi_email",
      "o.name as observer_name",
      "o.email as observer_email",
      "i.code as instrument_code",
      "i.name as instrument_name",
    ]);
  if (filter.telescopeId) q = q.where("b.telescope_id", "=", filter.telescopeId);
  if (filter.programId) q = q.where("b.program_id", "=", filter.programId);
  if (filter.observerUserId) q = q.where("b.observer_user_id", "=", filter.observerUserId);
  if (filter.from) q = q.where("b.ends_at", ">", filter.from);
  if (filter.to) q = q.where("b.starts_at", "<", filter.to);
  const rows = await q.orderBy("b.starts_at").orderBy("t.code").limit(MAX_EXPORT_BLOCKS).execute();
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    startsAt: r.starts_at,
    endsAt: r.ends_at,
    updatedAt: r.updated_at,
    notes: r.notes,
    telescope: { code: r.telescope_code, name: r.telescope_name },
    site: { name: r.site_name, timeZone: r.time_zone },
    program: { code: r.program_code, title: r.program_title },
    pi: { name: r.pi_name, email: r.pi_email },
    observer: r.observer_name !== null && r.observer_email !== null ? { name: r.observer_name, email: r.observer_email } : null,
    instrument: r.instrument_code !== null && r.instrument_name !== null ? { code: r.instrument_code, name: r.instrument_name } : null,
  }));
}
