"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";
import type { ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { siteSchema } from "@/lib/sites/schemas";
import { createSite, deleteSite, updateSite } from "@/lib/sites/service";

/** Creates a site (id null) or replaces one's fields. */
export async function saveSiteAction(id: string | null, input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    const values = siteSchema.parse(input);
    if (id === null) await createSite(getDb(), admin.id, values);
    else await updateSite(getDb(), admin.id, parseRecordId(id, "site"), values);
    revalidatePath("/admin", "layout");
    return { ok: true, message: id === null ? `Site ${values.code} created.` : `Site ${values.code} saved.` };
  });
}

export async function deleteSiteAction(id: string): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    await deleteSite(getDb(), admin.id, parseRecordId(id, "site"));
    revalidatePath("/admin", "layout");
    return { ok: true, message: "Site deleted." };
  });
}
