"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";
import type { ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { instrumentSchema } from "@/lib/instruments/schemas";
import { createInstrument, deleteInstrument, updateInstrument } from "@/lib/instruments/service";

/** Creates an instrument (id null) or replaces one's fields. */
export async function saveInstrumentAction(id: string | null, input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    const values = instrumentSchema.parse(input);
    if (id === null) await createInstrument(getDb(), admin.id, values);
    else await updateInstrument(getDb(), admin.id, parseRecordId(id, "instrument"), values);
    revalidatePath("/admin", "layout");
    return { ok: true, message: id === null ? `Instrument ${values.code} created.` : `Instrument ${values.code} saved.` };
  });
}

export async function deleteInstrumentAction(id: string): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    await deleteInstrument(getDb(), admin.id, parseRecordId(id, "instrument"));
    revalidatePath("/admin", "layout");
    return { ok: true, message: "Instrument deleted." };
  });
}
