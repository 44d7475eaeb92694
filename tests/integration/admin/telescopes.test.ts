import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { FieldError, RecordInUseError } from "@/lib/actions/domain-errors";
import { createPartner } from "@/lib/partners/service";
import { createProgram } from "@/lib/programs/service";
import { createSemester } from "@/lib/semesters/service";
import { createSite } from "@/lib/sites/service";
import { findTelescopeById, listTelescopeOptions, listTelescopes } from "@/lib/telescopes/queries";
import { telescopeSchema } from "@/lib/telescopes/schemas";
import { createTelescope, deleteTelescope, updateTelescope } from "@/lib/telescopes/service";
import { createInstrument } from "@/lib/instruments/service";
import { auditActions, instrumentInput, makeAdmin, makeBlock, makePerson, partnerInput, programInput, semesterInput, siteInput, telescopeInput } from "./fixtures";

async function setup() {
  const db = getDb();
  const admin = await makeAdmin();
  const siteId = await createSite(db, admin.id, siteInput());
  return { db, admin, siteId };
}

describe("admin: telescopes", () => {
  it("creates a telescope with its night assistants, edits both, and deletes it with its instruments", async () => {
    const { db, admin, siteId } = await setup();
    const [a, b] = [await makePerson(["night_assistant"]), await makePerson(["night_assistant", "observer"])];
    const input = telescopeInput(siteId, { assistantUserIds: [a.id] });
    const id = await createTelescope(db, admin.id, input);
    const created = await findTelescopeById(db, id);
    expect(created).toMatchObject({ code: input.code, siteId, apertureM: 2, maxAirmass: 2.5, hourAngleMinH: -6, setupMinutes: 10, blockCount: 0 });
    expect(created?.assistants.map((x) => x.id)).toEqual([a.id]);
    expect((await listTelescopes(db)).some((t) => t.id === id)).toBe(true);
    expect((await listTelescopeOptions(db)).some((t) => t.id === id)).toBe(true);

    await updateTelescope(db, admin.id, id, { ...input, maxAirmass: 2.0, sunAvoidanceDeg: 60, assistantUserIds: [b.id] });
    const edited = await findTelescopeById(db, id);
    expect(edited).toMatchObject({ maxAirmass: 2, sunAvoidanceDeg: 60 });
    expect(edited?.assistants.map((x) => x.id)).toEqual([b.id]);

    const instrumentId = await createInstrument(db, admin.id, instrumentInput(id));
    await deleteTelescope(db, admin.id, id);
    expect(await findTelescopeById(db, id)).toBeUndefined();
    expect(await db.selectFrom("instruments").select("id").where("id", "=", instrumentId).executeTakeFirst()).toBeUndefined();
    expect(await auditActions(id)).toEqual(["telescope.create", "telescope.update", "telescope.delete"]);
  });

  it("refuses a highest airmass below 1 in the schema, and the database refuses it too", async () => {
    const { db, admin, siteId } = await setup();
    const input = telescopeInput(siteId);
    const id = await createTelescope(db, admin.id, input);
    const before = await findTelescopeById(db, id);
    expect(telescopeSchema.safeParse({ ...input, maxAirmass: "0.8" }).success).toBe(false);
    await expect(updateTelescope(db, admin.id, id, { ...input, name: "Not saved", maxAirmass: 0.8 })).rejects.toThrow();
    expect(await findTelescopeById(db, id)).toEqual(before);
  });

  it("refuses assistants without the night assistant role, and leaves the telescope unchanged", async () => {
    const { db, admin, siteId } = await setup();
    const assistant = await makePerson(["night_assistant"]);
    const observer = await makePerson(["observer"]);
    const input = telescopeInput(siteId, { assistantUserIds: [assistant.id] });
    const id = await createTelescope(db, admin.id, input);
    const before = await findTelescopeById(db, id);
    const refusal = updateTelescope(db, admin.id, id, { ...input, name: "Renamed", assistantUserIds: [observer.id] });
    await expect(refusal).rejects.toBeInstanceOf(FieldError);
    await expect(refusal).rejects.toMatchObject({ field: "assistantUserIds", message: expect.stringMatching(/does not hold the night assistant role/) });
    expect(await findTelescopeById(db, id)).toEqual(before);
  });

  it("refuses a duplicate code and an unknown site, each beside its field", async () => {
    const { db, admin, siteId } = await setup();
    const first = telescopeInput(siteId);
    await createTelescope(db, admin.id, first);
    await expect(createTelescope(db, admin.id, telescopeInput(siteId, { code: first.code }))).rejects.toMatchObject({
      field: "code",
      message: `A telescope with the code ${first.code} already exists.`,
    });
    await expect(createTelescope(db, admin.id, telescopeInput("00000000-0000-4000-8000-000000000000"))).rejects.toMatchObject({ field: "siteId" });
  });

  it("refuses to delete a telescope that still has scheduled blocks", async () => {
    const { db, admin, siteId } = await setup();
    const t = telescopeInput(siteId);
    const telescopeId = await createTelescope(db, admin.id, t);
    const pi = await makePerson(["pi"]);
    const semesterId = await createSemester(db, admin.id, semesterInput());
    const partnerId = await createPartner(db, admin.id, partnerInput());
    const programId = await createProgram(db, admin.id, programInput({ semesterId, partnerId, piUserId: pi.id }));
    await makeBlock({ telescopeId, programId, startsAt: new Date("2027-03-01T02:00:00Z"), endsAt: new Date("2027-03-01T04:00:00Z") });
    const refusal = deleteTelescope(db, admin.id, telescopeId);
    await expect(refusal).rejects.toBeInstanceOf(RecordInUseError);
    await expect(refusal).rejects.toThrow(`Telescope ${t.code} still has 1 scheduled block`);
    expect(await findTelescopeById(db, telescopeId)).toBeDefined();
  });
});
