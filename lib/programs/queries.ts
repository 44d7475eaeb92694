import { sql } from "kysely";
import type { Db, Trx } from "@/db/index";
import type { BlockKind } from "@/db/types";
import type { ProgramInput } from "./schemas";

export interface ProgramSummary {
  id: string;
  code: string;
  title: string;
  category: BlockKind;
  rank: number;
  allocatedHours: number;
  tooAllowed: boolean;
  semesterCode: string;
  partnerCode: string;
}

export async function listProgramsForPi(db: Db, userId: string): Promise<ProgramSummary[]> {
  const rows = await db
    .selectFrom("programs as p")
    .innerJoin("semesters as s", "s.id", "p.semester_id")
    .innerJoin("partners as pa", "pa.id", "p.partner_id")
    .select(["p.id", "p.code", "p.title", "p.category", "p.rank", "p.allocated_hours", "p.too_allowed", "s.code as semester_code", "pa.code as partner_code"])
    .where("p.pi_user_id", "=", userId)
    .orderBy("p.code")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    code: r.code,
    title: r.title,
    category: r.category,
    rank: r.rank,
    allocatedHours: r.allocated_hours,
    tooAllowed: r.too_allowed,
    semesterCode: r.semester_code,
    partnerCode: r.partner_code,
  }));
}

export interface ConsortiumCounts {
  users: number;
  programs: number;
  telescopes: number;
  blocks: number;
}

export async function countConsortium(db: Db): Promise<ConsortiumCounts> {
  const count = async (table: "users" | "programs" | "telescopes" | "blocks") =>
    Number((await db.selectFrom(table).select((eb) => eb.fn.countAll<number>().as("n")).executeTakeFirstOrThrow()).n);
  const [users, programs, telescopes, blocks] = await Promise.all([count("users"), count("programs"), count("telescopes"), count("blocks")]);
  return { users, programs, telescopes, blocks };
}

export interface PersonRef {
  id: string;
  name: string;
}

/** A program as the admin pages see it. */
export interface Program {
  id: string;
  code: string;
  title: string;
  semesterId: string;
  semesterCode: string;
  partnerId: string;
  partnerCode: string;
  piUserId: string;
  piName: string;
  rank: number;
  allocatedHours: number;
  category: BlockKind;
  tooAllowed: boolean;
  observers: PersonRef[];
  blockCount: number;
}

function programsQuery(db: Db | Trx) {
  return db
    .selectFrom("programs as p")
    .innerJoin("semesters as s", "s.id", "p.semester_id")
    .innerJoin("partners as pa", "pa.id", "p.partner_id")
    .innerJoin("users as pi", "pi.id", "p.pi_user_id")
    .select((eb) => [
      "p.id",
      "p.code",
      "p.title",
      "p.semester_id",
      "s.code as semester_code",
      "p.partner_id",
      "pa.code as partner_code",
      "p.pi_user_id",
      "pi.name as pi_name",
      "p.rank",
      "p.allocated_hours",
      "p.category",
      "p.too_allowed",
      sql<PersonRef[]>`coalesce((
        select json_agg(json_build_object('id', u.id, 'name', u.name) order by u.name)
        from program_observers po join users u on u.id = po.user_id
        where po.program_id = p.id), '[]'::json)`.as("observers"),
      eb.selectFrom("blocks as b").select(eb.fn.countAll<number>().as("n")).whereRef("b.program_id", "=", "p.id").as("block_count"),
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof programsQuery>["execute"]>>[number];

function toProgram(r: Row): Program {
  return {
    id: r.id,
    code: r.code,
    title: r.title,
    semesterId: r.semester_id,
    semesterCode: r.semester_code,
    partnerId: r.partner_id,
    partnerCode: r.partner_code,
    piUserId: r.pi_user_id,
    piName: r.pi_name,
    rank: r.rank,
    allocatedHours: r.allocated_hours,
    category: r.category,
    tooAllowed: r.too_allowed,
    observers: r.observers,
    blockCount: Number(r.block_count ?? 0),
  };
}

export async function listPrograms(db: Db): Promise<Program[]> {
  return (await programsQuery(db).orderBy("s.starts_at", "desc").orderBy("p.code").execute()).map(toProgram);
}

export async function findProgramById(db: Db | Trx, id: string): Promise<Program | undefined> {
  const row = await programsQuery(db).where("p.id", "=", id).executeTakeFirst();
  return row && toProgram(row);
}

export async function findProgramIdByCode(trx: Db | Trx, code: string): Promise<string | undefined> {
  return (await trx.selectFrom("programs").select("id").where("code", "=", code).executeTakeFirst())?.id;
}

export async function lockProgram(trx: Trx, id: string): Promise<Program | undefined> {
  const locked = await trx.selectFrom("programs").select("id").where("id", "=", id).forUpdate().executeTakeFirst();
  return locked && findProgramById(trx, id);
}

function columns(input: ProgramInput) {
  return {
    code: input.code,
    title: input.title,
    semester_id: input.semesterId,
    partner_id: input.partnerId,
    pi_user_id: input.piUserId,
    rank: input.rank,
    allocated_hours: input.allocatedHours,
    category: input.category,
    too_allowed: input.tooAllowed,
  };
}

export async function insertProgram(trx: Trx, input: ProgramInput): Promise<string> {
  return (await trx.insertInto("programs").values(columns(input)).returning("id").executeTakeFirstOrThrow()).id;
}

export async function updateProgramById(trx: Trx, id: string, input: ProgramInput): Promise<void> {
  await trx.updateTable("programs").set(columns(input)).where("id", "=", id).execute();
}

export async function replaceProgramObservers(trx: Trx, programId: string, userIds: readonly string[]): Promise<void> {
  await trx.deleteFrom("program_observers").where("program_id", "=", programId).execute();
  if (userIds.length) {
    await trx.insertInto("program_observers").values(userIds.map((user_id) => ({ program_id: programId, user_id }))).execute();
  }
}

export async function deleteProgramById(trx: Trx, id: string): Promise<void> {
  await trx.deleteFrom("programs").where("id", "=", id).execute();
}
