import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { findSiteById, listSiteOptions, listSites } from "@/lib/sites/queries";
import { siteSchema } from "@/lib/sites/schemas";
import { createSite, deleteSite, updateSite } from "@/lib/sites/service";
import { createTelescope } from "@/lib/telescopes/service";
import { auditActions, makeAdmin, siteInput, telescopeInput } from "./fixtures";

describe("admin: sites", () => {
  it("creates, edits and deletes a site, with an audit row for each step", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const input = siteInput();
    const id = await createSite(db, admin.id, input);
    expect(await findSiteById(db, id)).toEqual({ id, ...input, telescopeCount: 0 });
    expect((await listSites(db)).some((s) => s.id === id)).toBe(true);
    expect((await listSiteOptions(db)).find((s) => s.id === id)).toEqual({ id, code: input.code, name: input.name });

    const edited = { ...input, name: "Renamed", latitudeDeg: 38.41, longitudeDeg: -3.72, heightM: 1850, timeZone: "Europe/Madrid" };
    await updateSite(db, admin.id, id, edited);
    expect(await findSiteById(db, id)).toMatchObject(edited);

    await deleteSite(db, admin.id, id);
    expect(await findSiteById(db, id)).toBeUndefined();
    expect(await auditActions(id)).toEqual(["site.create", "site.update", "site.delete"]);
  });

  it("refuses a duplicate code beside the code field, on create and on edit", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const first = siteInput();
    await createSite(db, admin.id, first);
    const duplicate = createSite(db, admin.id, siteInput({ code: first.code }));
    await expect(duplicate).rejects.toBeInstanceOf(FieldError);
    await expect(duplicate).rejects.toMatchObject({ field: "code", message: `A site with the code ${first.code} already exists.` });

    const other = siteInput();
    const otherId = await createSite(db, admin.id, other);
    await expect(updateSite(db, admin.id, otherId, { ...other, code: first.code })).rejects.toMatchObject({ field: "code" });
    expect((await findSiteById(db, otherId))?.code).toBe(other.code);
    // Saving a site under its own code is not a conflict.
    await updateSite(db, admin.id, otherId, { ...other, name: "Same code, new name" });
  });

  it("keeps bad coordinates and unknown time zones out, leaving the stored site as it was", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const input = siteInput();
    const id = await createSite(db, admin.id, input);
    const before = await findSiteById(db, id);

    for (const bad of [{ latitudeDeg: "95" }, { longitudeDeg: "-200" }, { timeZone: "Atlantis/Lost_City" }]) {
      const parsed = siteSchema.safeParse({ ...input, ...bad });
      expect(parsed.success).toBe(false);
    }
    // Past the schema (a caller that skipped it), the database's checks still refuse, and the transaction rolls back.
    await expect(updateSite(db, admin.id, id, { ...input, name: "Should not stick", latitudeDeg: 95 })).rejects.toThrow();
    expect(await findSiteById(db, id)).toEqual(before);
    expect(await auditActions(id)).toEqual(["site.create"]);
  });

  it("refuses to delete a site that still has telescopes, and says how many", async () => {
    const db = getDb();
    const admin = await makeAdmin();
    const site = siteInput();
    const siteId = await createSite(db, admin.id, site);
    await createTelescope(db, admin.id, telescopeInput(siteId));
    const refusal = deleteSite(db, admin.id, siteId);
    await expect(refusal).rejects.toBeInstanceOf(RecordInUseError);
    await expect(refusal).rejects.toThrow(`Site ${site.code} still has 1 telescope`);
    expect(await findSiteById(db, siteId)).toBeDefined();
  });

  it("answers a missing site with a clear message", async () => {
    const admin = await makeAdmin();
    const missing = "00000000-0000-4000-8000-000000000000";
    await expect(updateSite(getDb(), admin.id, missing, siteInput())).rejects.toBeInstanceOf(RecordNotFoundError);
    await expect(deleteSite(getDb(), admin.id, missing)).rejects.toBeInstanceOf(RecordNotFoundError);
  });
});
