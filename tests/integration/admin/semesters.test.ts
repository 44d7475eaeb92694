import { sql } from "kysely";
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { FieldError, RecordInUseError } from "@/lib/actions/domain-errors";
import { runFormAction } from "@/lib/actions/form-action";
import { createPartner } from "@/lib/partners/service";
import { createProgram } from "@/lib/programs/service";
import { findSemesterById, listSemesterOptions, listSemesters } from "@/lib/semesters/queries";
import { semesterSchema } from "@/lib/semesters/schemas";
import { createSemester, deleteSemester, updateSemester } from "@/lib/semesters/service";
import { createSite } from "@/lib/sites/service";
import { createTelescope } from "@/lib/telescopes/service";
import { auditActions, makeAdmin, makeBlock, makePerson, partnerInput, programInput, semesterInput, siteInput, telescopeInput, uniqueCode } from "./fixtures";

const at = (iso: string) => new Date(iso);

/** Semesters with the given code stem and dates; each test keeps to years no other test uses. */
const dated = (stem: string, startsAt: string, endsAt: string) => semesterInput({ code: uniqueCode(stem), startsAt: at(startsAt), endsAt: at(endsAt) });

async function semesterRowsCoded(code: string) {
  return getDb().selectFrom("semesters").select("id").where("code", "=", code).execute();
}

async function waitForLockWait(): Promise<void> {
  for (let i = 0; i < 200; i++) {
    const { rows } = await sql<{ n: number }>`select count(*)::int as n from pg_stat_activity where datname = current_database() and wait_event_type = 'Lock'`.execute(getDb());
    if ((rows[0]?.n ?? 0) > 0) return;
    await new Promise((r) => setTimeout(r, 25));
  }
  throw new Error("the second save never waited on the first");
}

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
    const input = semesterInput({ startsAt: at("2028-02-01T00:00:00Z"), endsAt: at("2028-08-01T00:00:00Z") });
    const semesterId = await createSemester(db, admin.id, input);
    const partnerId = await createPartner(db, admin.id, partnerInput());
    const pi = await makePerson(["pi"]);
    const programId = await createProgram(db, admin.id, programInput({ semesterId, partnerId, piUserId: pi.id }));
    const telescopeId = await createTelescope(db, admin.id, telescopeInput(await createSite(db, admin.id, siteInput())));
    await makeBlock({ telescopeId, programId, startsAt: at("2028-07-20T02:00:00Z"), endsAt: at("2028-07-20T05:00:00Z") });
    const before = await findSemesterById(db, semesterId);

    await expect(updateSemester(db, admin.id, semesterId, { ...input, endsAt: at("2028-07-01T00:00:00Z") })).rejects.toMatchObject({
      field: "endsAt",
      message: expect.stringMatching(/1 block .* after the new end/),
    });
    await expect(updateSemester(db, admin.id, semesterId, { ...input, startsAt: at("2028-07-21T00:00:00Z") })).rejects.toMatchObject({ field: "startsAt" });
    const refusal = deleteSemester(db, admin.id, semesterId);
    await expect(refusal).rejects.toBeInstanceOf(RecordInUseError);
    await expect(refusal).rejects.toThrow(/still has 1 program/);
    expect(await findSemesterById(db, semesterId)).toEqual(before);
  });
  it("refuses a semester that overlaps another, naming it beside the start or the end; touching is fine", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const b = dated("S2030-B", "2030-11-01T00:00:00Z", "2031-05-01T00:00:00Z");
    await createSemester(db, admin.id, b);
    const named = `Overlaps ${b.code} (2030-11-01 00:00 to 2031-05-01 00:00 UT): semesters may not share time. Nothing was saved.`;

    // Starts inside b: the start is what is wrong.
    const a = dated("S2031-A", "2031-04-01T00:00:00Z", "2031-10-01T00:00:00Z");
    const refusal = createSemester(db, admin.id, a);
    await expect(refusal).rejects.toBeInstanceOf(FieldError);
    await expect(refusal).rejects.toMatchObject({ field: "startsAt", message: named });
    expect(await semesterRowsCoded(a.code)).toEqual([]);
    // The form gets it beside the field, as the admin page's action answers.
    expect(await runFormAction(async () => ({ ok: true as const, data: await createSemester(db, admin.id, a) }))).toEqual({ ok: false, message: named, fieldErrors: { startsAt: named } });

    // Ends inside b, or wraps it whole: the end is what is wrong.
    await expect(createSemester(db, admin.id, dated("S2030-A", "2030-05-01T00:00:00Z", "2030-11-02T00:00:00Z"))).rejects.toMatchObject({ field: "endsAt", message: named });
    await expect(createSemester(db, admin.id, dated("S2030-X", "2030-01-01T00:00:00Z", "2032-01-01T00:00:00Z"))).rejects.toMatchObject({ field: "endsAt", message: named });

    // Half-open: one ending as b starts, one starting as b ends, touch without overlapping.
    const before = await createSemester(db, admin.id, dated("S2030-A", "2030-05-01T00:00:00Z", "2030-11-01T00:00:00Z"));
    const after = dated("S2031-A", "2031-05-01T00:00:00Z", "2031-11-01T00:00:00Z");
    const afterId = await createSemester(db, admin.id, after);
    expect(await findSemesterById(db, before)).toBeDefined();

    // Moving a semester onto another is refused as well, and its row stays as it was.
    const unchanged = await findSemesterById(db, afterId);
    await expect(updateSemester(db, admin.id, afterId, { ...after, startsAt: at("2031-04-15T00:00:00Z") })).rejects.toMatchObject({ field: "startsAt", message: named });
    expect(await findSemesterById(db, afterId)).toEqual(unchanged);
    expect(await auditActions(afterId)).toEqual(["semester.create"]);
    // Its own old dates never count against it.
    await updateSemester(db, admin.id, afterId, { ...after, endsAt: at("2031-10-31T00:00:00Z") });
  });

  it("holds in the database: an overlapping row written straight to the table is refused (semesters_no_overlap)", async () => {
    const db = getDb();
    const row = (stem: string, startsAt: string, endsAt: string) => ({ code: uniqueCode(stem), starts_at: at(startsAt), ends_at: at(endsAt) });
    await db.insertInto("semesters").values(row("S2033-A", "2033-01-01T00:00:00Z", "2033-07-01T00:00:00Z")).execute();
    const overlapping = row("S2033-B", "2033-06-30T23:59:00Z", "2034-01-01T00:00:00Z");
    await expect(db.insertInto("semesters").values(overlapping).execute()).rejects.toMatchObject({ code: "23P01", constraint: "semesters_no_overlap" });
    expect(await semesterRowsCoded(overlapping.code)).toEqual([]);
    await db.insertInto("semesters").values(row("S2033-B", "2033-07-01T00:00:00Z", "2034-01-01T00:00:00Z")).execute();
  });

  it("gives a save that loses the race past the check the same field error", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const first = dated("S2035-A", "2035-01-01T00:00:00Z", "2035-07-01T00:00:00Z");
    let inserted!: () => void;
    let commit!: () => void;
    const insertedYet = new Promise<void>((r) => (inserted = r));
    const commitNow = new Promise<void>((r) => (commit = r));
    // The first save inserts and holds its transaction open: the second's check cannot see it.
    const holder = db.transaction().execute(async (trx) => {
      await trx.insertInto("semesters").values({ code: first.code, starts_at: first.startsAt, ends_at: first.endsAt }).execute();
      inserted();
      await commitNow;
    });
    await insertedYet;
    const second = createSemester(db, admin.id, dated("S2035-B", "2035-06-01T00:00:00Z", "2035-12-01T00:00:00Z"));
    second.catch(() => undefined);
    await waitForLockWait(); // the second passed its check and waits on the constraint
    commit();
    await holder;
    await expect(second).rejects.toMatchObject({
      field: "startsAt",
      message: `Overlaps ${first.code} (2035-01-01 00:00 to 2035-07-01 00:00 UT): semesters may not share time. Nothing was saved.`,
    });
  });
});
