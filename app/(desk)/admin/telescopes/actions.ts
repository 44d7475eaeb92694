"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";
import type { ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { telescopeSchema } from "@/lib/telescopes/schemas";
import { createTelescope, deleteTelescope, updateTelescope } from "@/lib/telescopes/service";

/** Creates a telescope (id null) or replaces one's fields and night assistants. */
export async function saveTelescopeAction(id: string | null, input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    const values = telescopeSchema.parse(input);
    if (id === null) await createTelescope(getDb(), admin.id, values);
    else await updateTelescope(getDb(), admin.id, parseRecordId(id, "telescope"), values);
    revalidatePath("/admin", "layout");
    return { ok: true, message: id === null ? `Telescope ${values.code} created.` : `Telescope ${values.code} saved.` };
  });
}

export async function deleteTelescopeAction(id: string): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    await deleteTelescope(getDb(), admin.id, parseRecordId(id, "telescope"));
    revalidatePath("/admin", "layout");
    return { ok: true, message: "Telescope deleted." };
  });
}
