import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { FieldError, RecordInUseError } from "@/lib/actions/domain-errors";
import { createPartner } from "@/lib/partners/service";
import { findProgramById, listPrograms } from "@/lib/programs/queries";
import { programSchema } from "@/lib/programs/schemas";
import { createProgram, deleteProgram, updateProgram } from "@/lib/programs/service";
import { createSemester } from "@/lib/semesters/service";
import { createSite } from "@/lib/sites/service";
import { createTelescope } from "@/lib/telescopes/service";
import { listPeopleWithRole } from "@/lib/users/queries";
import { auditActions, makeAdmin, makeBlock, makePerson, partnerInput, programInput, semesterInput, siteInput, telescopeInput } from "./fixtures";

async function refs() {
  const db = getDb();
  const admin = await makeAdmin();
  const semesterId = await createSemester(db, admin.id, semesterInput());
  const partnerId = await createPartner(db, admin.id, partnerInput());
  const pi = await makePerson(["pi"]);
  return { db, admin, semesterId, partnerId, piUserId: pi.id };
}

describe("admin: programs", () => {
  it("creates a program with observers, edits it, and deletes it", async () => {
    const { db, admin, ...r } = await refs();
    const [o1, o2] = [await makePerson(["observer"]), await makePerson(["observer", "pi"])];
    const input = programInput(r, { observerUserIds: [o1.id], category: "discretionary", tooAllowed: true });
    const id = await createProgram(db, admin.id, input);
    const created = await findProgramById(db, id);
    expect(created).toMatchObject({ code: input.code, semesterId: r.semesterId, partnerId: r.partnerId, piUserId: r.piUserId, rank: 3, allocatedHours: 20, category: "discretionary", tooAllowed: true });
    expect(created?.observers.map((o) => o.id)).toEqual([o1.id]);
    expect((await listPrograms(db)).some((p) => p.id === id)).toBe(true);

    await updateProgram(db, admin.id, id, { ...input, rank: 1, allocatedHours: 12.5, piUserId: o2.id, observerUserIds: [o1.id, o2.id] });
    const edited = await findProgramById(db, id);
    expect(edited).toMatchObject({ rank: 1, allocatedHours: 12.5, piUserId: o2.id });
    expect(edited?.observers.map((o) => o.id).sort()).toEqual([o1.id, o2.id].sort());

    await deleteProgram(db, admin.id, id);
    expect(await findProgramById(db, id)).toBeUndefined();
    expect(await auditActions(id)).toEqual(["program.create", "program.update", "program.delete"]);
  });

  it("refuses a PI without the pi role, beside the PI field, leaving the program unchanged", async () => {
    const { db, admin, ...r } = await refs();
    const notPi = await makePerson(["observer"]);
    await expect(createProgram(db, admin.id, programInput({ ...r, piUserId: notPi.id }))).rejects.toMatchObject({
      field: "piUserId",
      message: expect.stringMatching(/does not hold the principal investigator role/),
    });
    const input = programInput(r);
    const id = await createProgram(db, admin.id, input);
    const before = await findProgramById(db, id);
    const refusal = updateProgram(db, admin.id, id, { ...input, title: "Changed", piUserId: notPi.id });
    await expect(refusal).rejects.toBeInstanceOf(FieldError);
    expect(await findProgramById(db, id)).toEqual(before);
    expect(await auditActions(id)).toEqual(["program.create"]);
  });

  it("refuses observers without the observer role and a duplicate code", async () => {
    const { db, admin, ...r } = await refs();
    const onlyPi = await makePerson(["pi"]);
    await expect(createProgram(db, admin.id, programInput(r, { observerUserIds: [onlyPi.id] }))).rejects.toMatchObject({ field: "observerUserIds" });
    const first = programInput(r);
    await createProgram(db, admin.id, first);
    await expect(createProgram(db, admin.id, programInput(r, { code: first.code }))).rejects.toMatchObject({
      field: "code",
      message: `A program with the code ${first.code} already exists.`,
    });
  });

  it("keeps rank and category within the schema's rules", () => {
    const base = { code: "X1", title: "t", semesterId: "00000000-0000-4000-8000-000000000001", partnerId: "00000000-0000-4000-8000-000000000002", piUserId: "00000000-0000-4000-8000-000000000003", allocatedHours: 1, category: "science", tooAllowed: false, observerUserIds: [] };
    expect(programSchema.safeParse({ ...base, rank: 6 }).success).toBe(false);
    expect(programSchema.safeParse({ ...base, rank: 2, category: "vacation" }).success).toBe(false);
    expect(programSchema.safeParse({ ...base, rank: 2 }).success).toBe(true);
  });

  it("refuses to delete a program with scheduled blocks", async () => {
    const { db, admin, ...r } = await refs();
    const input = programInput(r);
    const programId = await createProgram(db, admin.id, input);
    const telescopeId = await createTelescope(db, admin.id, telescopeInput(await createSite(db, admin.id, siteInput())));
    await makeBlock({ telescopeId, programId, startsAt: new Date("2027-04-01T01:00:00Z"), endsAt: new Date("2027-04-01T02:00:00Z") });
    const refusal = deleteProgram(db, admin.id, programId);
    await expect(refusal).rejects.toBeInstanceOf(RecordInUseError);
    await expect(refusal).rejects.toThrow(`Program ${input.code} still has 1 scheduled block`);
  });

  it("offers only active holders of a role in the pickers", async () => {
    const db = getDb();
    const active = await makePerson(["pi"]);
    const disabled = await makePerson(["pi"]);
    await db.updateTable("users").set({ disabled_at: new Date() }).where("id", "=", disabled.id).execute();
    const ids = (await listPeopleWithRole(db, "pi")).map((p) => p.id);
    expect(ids).toContain(active.id);
    expect(ids).not.toContain(disabled.id);
  });
});
