import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { RecordInUseError } from "@/lib/actions/domain-errors";
import { createPartner } from "@/lib/partners/service";
import { createProgram } from "@/lib/programs/service";
import { findSemesterById, listSemesterOptions, listSemesters } from "@/lib/semesters/queries";
import { semesterSchema } from "@/lib/semesters/schemas";
import { createSemester, deleteSemester, updateSemester } from "@/lib/semesters/service";
import { createSite } from "@/lib/sites/service";
import { createTelescope } from "@/lib/telescopes/service";
import { auditActions, makeAdmin, makeBlock, makePerson, partnerInput, programInput, semesterInput, siteInput, telescopeInput } from "./fixtures";

describe("admin: semesters", () => {
  it("creates, edits and deletes a semester, keeping UTC instants exact", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const input = semesterSchema.parse({ code: semesterInput().code, startsAt: "2027-02-01T00:00", endsAt: "2027-08-01T00:00" });
    const id = await createSemester(db, admin.id, input);
    const created = await findSemesterById(db, id);
    expect(created?.startsAt.toISOString()).toBe("2027-02-01T00:00:00.000Z");
    expect(created?.endsAt.toISOString()).toBe("2027-08-01T00:00:00.000Z");
    expect((await listSemesters(db)).some((s) => s.id === id)).toBe(true);
    expect((await listSemesterOptions(db)).some((s) => s.id === id)).toBe(true);

    await updateSemester(db, admin.id, id, { ...input, endsAt: new Date("2027-07-31T12:00:00Z") });
    expect((await findSemesterById(db, id))?.endsAt.toISOString()).toBe("2027-07-31T12:00:00.000Z");
    await deleteSemester(db, admin.id, id);
    expect(await findSemesterById(db, id)).toBeUndefined();
    expect(await auditActions(id)).toEqual(["semester.create", "semester.update", "semester.delete"]);
  });

  it("refuses an end before the start (schema and database) and a duplicate code, leaving the row unchanged", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const input = semesterInput();
    const id = await createSemester(db, admin.id, input);
    const before = await findSemesterById(db, id);
    expect(semesterSchema.safeParse({ ...input, endsAt: "2027-01-01T00:00" }).success).toBe(false);
    await expect(updateSemester(db, admin.id, id, { ...input, endsAt: new Date("2027-01-01T00:00:00Z") })).rejects.toThrow();

    const other = semesterInput();
    await createSemester(db, admin.id, other);
    await expect(updateSemester(db, admin.id, id, { ...input, code: other.code })).rejects.toMatchObject({
      field: "code",
      message: `A semester with the code ${other.code} already exists.`,
    });
    expect(await findSemesterById(db, id)).toEqual(before);
  });

  it("will not shrink past its programs' blocks, nor delete a semester with programs", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const input = semesterInput();
    const semesterId = await createSemester(db, admin.id, input);
    const partnerId = await createPartner(db, admin.id, partnerInput());
    const pi = await makePerson(["pi"]);
    const programId = await createProgram(db, admin.id, programInput({ semesterId, partnerId, piUserId: pi.id }));
    const telescopeId = await createTelescope(db, admin.id, telescopeInput(await createSite(db, admin.id, siteInput())));
    await makeBlock({ telescopeId, programId, startsAt: new Date("2027-07-20T02:00:00Z"), endsAt: new Date("2027-07-20T05:00:00Z") });
    const before = await findSemesterById(db, semesterId);

    await expect(updateSemester(db, admin.id, semesterId, { ...input, endsAt: new Date("2027-07-01T00:00:00Z") })).rejects.toMatchObject({
      field: "endsAt",
      message: expect.stringMatching(/1 block .* after the new end/),
    });
    await expect(updateSemester(db, admin.id, semesterId, { ...input, startsAt: new Date("2027-07-21T00:00:00Z") })).rejects.toMatchObject({ field: "startsAt" });
    const refusal = deleteSemester(db, admin.id, semesterId);
    await expect(refusal).rejects.toBeInstanceOf(RecordInUseError);
    await expect(refusal).rejects.toThrow(/still has 1 program/);
    expect(await findSemesterById(db, semesterId)).toEqual(before);
  });
});
