"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";
import type { ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { partnerSchema } from "@/lib/partners/schemas";
import { createPartner, deletePartner, updatePartner } from "@/lib/partners/service";

/** Creates a partner (id null) or renames one. */
export async function savePartnerAction(id: string | null, input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    const values = partnerSchema.parse(input);
    if (id === null) await createPartner(getDb(), admin.id, values);
    else await updatePartner(getDb(), admin.id, parseRecordId(id, "partner"), values);
    revalidatePath("/admin", "layout");
    return { ok: true, message: id === null ? `Partner ${values.code} created.` : `Partner ${values.code} saved.` };
  });
}

export async function deletePartnerAction(id: string): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    await deletePartner(getDb(), admin.id, parseRecordId(id, "partner"));
    revalidatePath("/admin", "layout");
    return { ok: true, message: "Partner deleted." };
  });
}
