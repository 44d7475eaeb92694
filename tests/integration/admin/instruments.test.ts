import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { RecordInUseError } from "@/lib/actions/domain-errors";
import { findInstrumentById, listInstruments } from "@/lib/instruments/queries";
import { createInstrument, deleteInstrument, updateInstrument } from "@/lib/instruments/service";
import { createPartner } from "@/lib/partners/service";
import { createProgram } from "@/lib/programs/service";
import { createSemester } from "@/lib/semesters/service";
import { createSite } from "@/lib/sites/service";
import { createTelescope } from "@/lib/telescopes/service";
import { auditActions, instrumentInput, makeAdmin, makeBlock, makePerson, partnerInput, programInput, semesterInput, siteInput, telescopeInput } from "./fixtures";

async function twoTelescopes() {
  const db = getDb();
  const admin = await makeAdmin();
  const siteId = await createSite(db, admin.id, siteInput());
  const first = await createTelescope(db, admin.id, telescopeInput(siteId));
  const second = await createTelescope(db, admin.id, telescopeInput(siteId));
  return { db, admin, first, second };
}

describe("admin: instruments", () => {
  it("creates, edits, moves and deletes an instrument", async () => {
    const { db, admin, first, second } = await twoTelescopes();
    const input = instrumentInput(first);
    const id = await createInstrument(db, admin.id, input);
    expect(await findInstrumentById(db, id)).toMatchObject({ code: input.code, telescopeId: first, limitingMagnitude: 22.5, blockCount: 0 });
    expect((await listInstruments(db)).some((i) => i.id === id)).toBe(true);

    await updateInstrument(db, admin.id, id, { ...input, telescopeId: second, limitingMagnitude: 23.1 });
    expect(await findInstrumentById(db, id)).toMatchObject({ telescopeId: second, limitingMagnitude: 23.1 });

    await deleteInstrument(db, admin.id, id);
    expect(await findInstrumentById(db, id)).toBeUndefined();
    expect(await auditActions(id)).toEqual(["instrument.create", "instrument.update", "instrument.delete"]);
  });

  it("allows the same code on two telescopes but not twice on one", async () => {
    const { db, admin, first, second } = await twoTelescopes();
    await createInstrument(db, admin.id, instrumentInput(first, { code: "CAM" }));
    await createInstrument(db, admin.id, instrumentInput(second, { code: "CAM" }));
    await expect(createInstrument(db, admin.id, instrumentInput(first, { code: "CAM" }))).rejects.toMatchObject({
      field: "code",
      message: "This telescope already has an instrument with the code CAM.",
    });
  });

  it("keeps an instrument that blocks use: no delete, no move to another telescope", async () => {
    const { db, admin, first, second } = await twoTelescopes();
    const input = instrumentInput(first);
    const id = await createInstrument(db, admin.id, input);
    const pi = await makePerson(["pi"]);
    const semesterId = await createSemester(db, admin.id, semesterInput());
    const partnerId = await createPartner(db, admin.id, partnerInput());
    const programId = await createProgram(db, admin.id, programInput({ semesterId, partnerId, piUserId: pi.id }));
    await makeBlock({ telescopeId: first, programId, instrumentId: id, startsAt: new Date("2027-03-02T02:00:00Z"), endsAt: new Date("2027-03-02T03:00:00Z") });
    const before = await findInstrumentById(db, id);

    await expect(updateInstrument(db, admin.id, id, { ...input, telescopeId: second })).rejects.toMatchObject({ field: "telescopeId" });
    await expect(deleteInstrument(db, admin.id, id)).rejects.toBeInstanceOf(RecordInUseError);
    expect(await findInstrumentById(db, id)).toEqual(before);
    // Editing its own fields on the same telescope is fine.
    await updateInstrument(db, admin.id, id, { ...input, name: "Refurbished camera" });
    expect((await findInstrumentById(db, id))?.name).toBe("Refurbished camera");
  });
});
