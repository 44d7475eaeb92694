import type { Db } from "@/db/index";
import type { BlockKind } from "@/db/types";

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
