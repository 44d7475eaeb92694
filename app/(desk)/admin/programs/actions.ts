"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";
import type { ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { programSchema } from "@/lib/programs/schemas";
import { createProgram, deleteProgram, updateProgram } from "@/lib/programs/service";

/** Creates a program (id null) or replaces one's fields and observers. */
export async function saveProgramAction(id: string | null, input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    const values = programSchema.parse(input);
    if (id === null) await createProgram(getDb(), admin.id, values);
    else await updateProgram(getDb(), admin.id, parseRecordId(id, "program"), values);
    revalidatePath("/admin", "layout");
    return { ok: true, message: id === null ? `Program ${values.code} created.` : `Program ${values.code} saved.` };
  });
}

export async function deleteProgramAction(id: string): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    await deleteProgram(getDb(), admin.id, parseRecordId(id, "program"));
    revalidatePath("/admin", "layout");
    return { ok: true, message: "Program deleted." };
  });
}
