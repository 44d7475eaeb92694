import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { RecordInUseError } from "@/lib/actions/domain-errors";
import { findPartnerById, listPartnerOptions, listPartners } from "@/lib/partners/queries";
import { createPartner, deletePartner, updatePartner } from "@/lib/partners/service";
import { createProgram } from "@/lib/programs/service";
import { createSemester } from "@/lib/semesters/service";
import { auditActions, makeAdmin, makePerson, partnerInput, programInput, semesterInput } from "./fixtures";

describe("admin: partners", () => {
  it("creates, renames and deletes a partner", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const input = partnerInput();
    const id = await createPartner(db, admin.id, input);
    expect(await findPartnerById(db, id)).toEqual({ id, ...input, programCount: 0 });
    expect((await listPartners(db)).some((p) => p.id === id)).toBe(true);
    expect((await listPartnerOptions(db)).some((p) => p.id === id)).toBe(true);
    await updatePartner(db, admin.id, id, { ...input, name: "Renamed partner" });
    expect((await findPartnerById(db, id))?.name).toBe("Renamed partner");
    await deletePartner(db, admin.id, id);
    expect(await findPartnerById(db, id)).toBeUndefined();
    expect(await auditActions(id)).toEqual(["partner.create", "partner.update", "partner.delete"]);
  });

  it("refuses a duplicate code without changing the row", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const a = partnerInput();
    const b = partnerInput();
    await createPartner(db, admin.id, a);
    const id = await createPartner(db, admin.id, b);
    await expect(createPartner(db, admin.id, partnerInput({ code: a.code }))).rejects.toMatchObject({ field: "code" });
    await expect(updatePartner(db, admin.id, id, { code: a.code, name: "Changed" })).rejects.toMatchObject({
      message: `A partner with the code ${a.code} already exists.`,
    });
    expect(await findPartnerById(db, id)).toEqual({ id, ...b, programCount: 0 });
  });

  it("refuses to delete a partner that still has programs", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const partnerId = await createPartner(db, admin.id, partnerInput());
    const semesterId = await createSemester(db, admin.id, semesterInput());
    const pi = await makePerson(["pi"]);
    await createProgram(db, admin.id, programInput({ semesterId, partnerId, piUserId: pi.id }));
    await expect(deletePartner(db, admin.id, partnerId)).rejects.toBeInstanceOf(RecordInUseError);
    expect(await findPartnerById(db, partnerId)).toMatchObject({ programCount: 1 });
  });
});
