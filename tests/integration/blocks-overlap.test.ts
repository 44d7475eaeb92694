import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { makeTelescopeAndProgram } from "./fixtures";

const at = (iso: string) => new Date(iso);

async function insertBlock(telescopeId: string, programId: string, start: string, end: string) {
  return getDb()
    .insertInto("blocks")
    .values({ telescope_id: telescopeId, program_id: programId, kind: "science", starts_at: at(start), ends_at: at(end) })
    .returning("id")
    .executeTakeFirstOrThrow();
}

function pgCode(error: unknown): string | undefined {
  return (error as { code?: string }).code;
}

describe("the no-overlap constraint on blocks", () => {
  it("rejects a block that overlaps another on the same telescope (SQLSTATE 23P01)", async () => {
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    await insertBlock(telescopeId, programId, "2027-02-01T23:00:00Z", "2027-02-02T03:00:00Z");
    const error = await insertBlock(telescopeId, programId, "2027-02-02T02:59:00Z", "2027-02-02T05:00:00Z").catch((e: unknown) => e);
    expect(pgCode(error)).toBe("23P01");
    const inside = await insertBlock(telescopeId, programId, "2027-02-02T00:00:00Z", "2027-02-02T01:00:00Z").catch((e: unknown) => e);
    expect(pgCode(inside)).toBe("23P01");
  });

  it("accepts blocks that only touch end to start", async () => {
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    await insertBlock(telescopeId, programId, "2027-02-01T23:00:00Z", "2027-02-02T03:00:00Z");
    await expect(insertBlock(telescopeId, programId, "2027-02-02T03:00:00Z", "2027-02-02T06:00:00Z")).resolves.toHaveProperty("id");
    await expect(insertBlock(telescopeId, programId, "2027-02-01T20:00:00Z", "2027-02-01T23:00:00Z")).resolves.toHaveProperty("id");
  });

  it("allows the same hours on two different telescopes", async () => {
    const a = await makeTelescopeAndProgram();
    const b = await makeTelescopeAndProgram();
    await insertBlock(a.telescopeId, a.programId, "2027-03-01T23:00:00Z", "2027-03-02T03:00:00Z");
    await expect(insertBlock(b.telescopeId, b.programId, "2027-03-01T23:00:00Z", "2027-03-02T03:00:00Z")).resolves.toHaveProperty("id");
  });

  it("rejects an update that moves a block onto another one", async () => {
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    await insertBlock(telescopeId, programId, "2027-04-01T23:00:00Z", "2027-04-02T01:00:00Z");
    const second = await insertBlock(telescopeId, programId, "2027-04-02T01:00:00Z", "2027-04-02T03:00:00Z");
    const error = await getDb()
      .updateTable("blocks")
      .set({ starts_at: at("2027-04-02T00:30:00Z") })
      .where("id", "=", second.id)
      .execute()
      .catch((e: unknown) => e);
    expect(pgCode(error)).toBe("23P01");
  });

  it("rejects an empty or reversed block", async () => {
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    const error = await insertBlock(telescopeId, programId, "2027-05-01T03:00:00Z", "2027-05-01T03:00:00Z").catch((e: unknown) => e);
    expect(pgCode(error)).toBe("23514");
  });
});
