import type { Db, Trx } from "@/db/index";
import type { SemesterInput } from "./schemas";

export interface Semester {
  id: string;
  code: string;
  startsAt: Date;
  endsAt: Date;
  programCount: number;
}

export interface SemesterOption {
  id: string;
  code: string;
}

function semestersQuery(db: Db | Trx) {
  return db
    .selectFrom("semesters as s")
    .select((eb) => [
      "s.id",
      "s.code",
      "s.starts_at",
      "s.ends_at",
      eb.selectFrom("programs as p").select(eb.fn.countAll<number>().as("n")).whereRef("p.semester_id", "=", "s.id").as("program_count"),
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof semestersQuery>["execute"]>>[number];

function toSemester(r: Row): Semester {
  return { id: r.id, code: r.code, startsAt: r.starts_at, endsAt: r.ends_at, programCount: Number(r.program_count ?? 0) };
}

/** Newest first: the semester being planned is the one admins edit most. */
export async function listSemesters(db: Db): Promise<Semester[]> {
  return (await semestersQuery(db).orderBy("s.starts_at", "desc").execute()).map(toSemester);
}

export async function findSemesterById(db: Db | Trx, id: string): Promise<Semester | undefined> {
  const row = await semestersQuery(db).where("s.id", "=", id).executeTakeFirst();
  return row && toSemester(row);
}

export async function listSemesterOptions(db: Db): Promise<SemesterOption[]> {
  return db.selectFrom("semesters").select(["id", "code"]).orderBy("starts_at", "desc").execute();
}

export async function findSemesterIdByCode(trx: Db | Trx, code: string): Promise<string | undefined> {
  return (await trx.selectFrom("semesters").select("id").where("code", "=", code).executeTakeFirst())?.id;
}

export async function lockSemester(trx: Trx, id: string): Promise<Semester | undefined> {
  const locked = await trx.selectFrom("semesters").select("id").where("id", "=", id).forUpdate().executeTakeFirst();
  return locked && findSemesterById(trx, id);
}

/**
 * The earliest other semester sharing time with [startsAt, endsAt). Plain comparisons, not
 * a range, so that an end before the start finds nothing and the CHECK refuses it instead.
 */
export async function findOverlappingSemester(db: Db | Trx, startsAt: Date, endsAt: Date, exceptId?: string): Promise<Omit<Semester, "programCount"> | undefined> {
  let q = db.selectFrom("semesters").select(["id", "code", "starts_at", "ends_at"]).where("starts_at", "<", endsAt).where("ends_at", ">", startsAt);
  if (exceptId) q = q.where("id", "<>", exceptId);
  const row = await q.orderBy("starts_at").limit(1).executeTakeFirst();
  return row && { id: row.id, code: row.code, startsAt: row.starts_at, endsAt: row.ends_at };
}

/** Blocks of the semester's programs that begin before startsAt or end after endsAt. */
export async function countBlocksOutside(trx: Trx, semesterId: string, startsAt: Date, endsAt: Date): Promise<{ early: number; late: number }> {
  const row = await trx
    .selectFrom("blocks as b")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .select((eb) => [
      eb.fn.countAll<number>().filterWhere("b.starts_at", "<", startsAt).as("early"),
      eb.fn.countAll<number>().filterWhere("b.ends_at", ">", endsAt).as("late"),
    ])
    .where("p.semester_id", "=", semesterId)
    .executeTakeFirstOrThrow();
  return { early: Number(row.early), late: Number(row.late) };
}

function columns(input: SemesterInput) {
  return { code: input.code, starts_at: input.startsAt, ends_at: input.endsAt };
}

export async function insertSemester(trx: Trx, input: SemesterInput): Promise<string> {
  return (await trx.insertInto("semesters").values(columns(input)).returning("id").executeTakeFirstOrThrow()).id;
}

export async function updateSemesterById(trx: Trx, id: string, input: SemesterInput): Promise<void> {
  await trx.updateTable("semesters").set(columns(input)).where("id", "=", id).execute();
}

export async function deleteSemesterById(trx: Trx, id: string): Promise<void> {
  await trx.deleteFrom("semesters").where("id", "=", id).execute();
}
