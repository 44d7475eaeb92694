/**
 * Reads of the time-owed ledger (Kysely only): entries summed per semester, partner and
 * program, and the balance still owed to one program.
 */
import { sql } from "kysely";
import type { Db, Trx } from "@/db/index";
import type { LedgerRow } from "./balances";

export interface LedgerFilter {
  semesterId?: string;
  partnerId?: string;
  /** Only these programs (a PI's or an observer's); undefined means all. */
  programIds?: readonly string[];
}

const sumOf = (kind: "charge" | "credit" | "repay") => sql<number>`coalesce(sum(le.minutes) filter (where le.kind = ${kind}), 0)::float8`;

export async function listLedgerRows(db: Db | Trx, filter: LedgerFilter = {}): Promise<LedgerRow[]> {
  if (filter.programIds && filter.programIds.length === 0) return [];
  let q = db
    .selectFrom("ledger_entries as le")
    .innerJoin("programs as p", "p.id", "le.program_id")
    .innerJoin("semesters as s", "s.id", "le.semester_id")
    .innerJoin("partners as pa", "pa.id", "le.partner_id")
    .select([
      "le.semester_id",
      "s.code as semester_code",
      "le.partner_id",
      "pa.code as partner_code",
      "pa.name as partner_name",
      "le.program_id",
      "p.code as program_code",
      "p.title as program_title",
      sumOf("charge").as("charged"),
      sumOf("credit").as("credited"),
      sumOf("repay").as("repaid"),
    ])
    .groupBy(["le.semester_id", "s.code", "le.partner_id", "pa.code", "pa.name", "le.program_id", "p.code", "p.title"]);
  if (filter.semesterId) q = q.where("le.semester_id", "=", filter.semesterId);
  if (filter.partnerId) q = q.where("le.partner_id", "=", filter.partnerId);
  if (filter.programIds) q = q.where("le.program_id", "in", [...filter.programIds]);
  const rows = await q.execute();
  return rows.map((r) => ({
    semesterId: r.semester_id,
    semesterCode: r.semester_code,
    partnerId: r.partner_id,
    partnerCode: r.partner_code,
    partnerName: r.partner_name,
    programId: r.program_id,
    programCode: r.program_code,
    programTitle: r.program_title,
    chargedMinutes: r.charged,
    creditedMinutes: r.credited,
    repaidMinutes: r.repaid,
  }));
}

/** Minutes still owed to a program in a semester: credited − repaid. */
export async function findOwedMinutes(db: Db | Trx, programId: string, semesterId: string): Promise<number> {
  const row = await db
    .selectFrom("ledger_entries as le")
    .select([sumOf("credit").as("credited"), sumOf("repay").as("repaid")])
    .where("le.program_id", "=", programId)
    .where("le.semester_id", "=", semesterId)
    .executeTakeFirst();
  return (row?.credited ?? 0) - (row?.repaid ?? 0);
}

/** The programs a person may see on the ledger: those they lead, observe, or lost time on. */
export async function listLedgerProgramIdsFor(db: Db | Trx, userId: string): Promise<string[]> {
  const rows = await db
    .selectFrom("programs as p")
    .select("p.id")
    .where((eb) =>
      eb.or([
        eb("p.pi_user_id", "=", userId),
        eb.exists(eb.selectFrom("program_observers as po").select("po.program_id").whereRef("po.program_id", "=", "p.id").where("po.user_id", "=", userId)),
        eb.exists(eb.selectFrom("displacements as d").select("d.id").whereRef("d.program_id", "=", "p.id").where("d.observer_user_id", "=", userId)),
      ]),
    )
    .execute();
  return rows.map((r) => r.id);
}

export interface LedgerOption {
  id: string;
  code: string;
  label: string;
}

/** Semesters and partners that appear on the ledger, for the filters. */
export async function listLedgerFilterOptions(db: Db): Promise<{ semesters: LedgerOption[]; partners: LedgerOption[] }> {
  const [semesters, partners] = await Promise.all([
    db.selectFrom("semesters").select(["id", "code"]).orderBy("starts_at", "desc").execute(),
    db.selectFrom("partners").select(["id", "code", "name"]).orderBy("code").execute(),
  ]);
  return {
    semesters: semesters.map((s) => ({ id: s.id, code: s.code, label: s.code })),
    partners: partners.map((p) => ({ id: p.id, code: p.code, label: `${p.code} — ${p.name}` })),
  };
}

export interface PaybackTelescope {
  id: string;
  code: string;
  name: string;
  site: { code: string; name: string; timeZone: string; latitudeDeg: number; longitudeDeg: number; heightM: number };
}

/** A telescope with its site: the notice names both, and the night check needs the site's place. */
export async function findPaybackTelescope(db: Db | Trx, telescopeId: string): Promise<PaybackTelescope | undefined> {
  const row = await db
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "s.code as site_code", "s.name as site_name", "s.time_zone", "s.latitude_deg", "s.longitude_deg", "s.height_m"])
    .where("t.id", "=", telescopeId)
    .executeTakeFirst();
  return (
    row && {
      id: row.id,
      code: row.code,
      name: row.name,
      site: { code: row.site_code, name: row.site_name, timeZone: row.time_zone, latitudeDeg: row.latitude_deg, longitudeDeg: row.longitude_deg, heightM: row.height_m },
    }
  );
}
