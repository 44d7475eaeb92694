"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";
import type { ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { semesterSchema } from "@/lib/semesters/schemas";
import { createSemester, deleteSemester, updateSemester } from "@/lib/semesters/service";

/** Creates a semester (id null) or replaces one's code and dates. */
export async function saveSemesterAction(id: string | null, input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    const values = semesterSchema.parse(input);
    if (id === null) await createSemester(getDb(), admin.id, values);
    else await updateSemester(getDb(), admin.id, parseRecordId(id, "semester"), values);
    revalidatePath("/admin", "layout");
    return { ok: true, message: id === null ? `Semester ${values.code} created.` : `Semester ${values.code} saved.` };
  });
}

export async function deleteSemesterAction(id: string): Promise<ActionResult> {
  return runFormAction(async () => {
    const admin = await requireActionRole("admin");
    await deleteSemester(getDb(), admin.id, parseRecordId(id, "semester"));
    revalidatePath("/admin", "layout");
    return { ok: true, message: "Semester deleted." };
  });
}
