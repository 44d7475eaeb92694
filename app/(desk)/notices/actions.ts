"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { getDb } from "@/db/index";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { markAllNoticesRead, markNoticeRead, setEmailPreferences, type EmailPreferences } from "@/lib/notices/queries";
import { noticeIdSchema, preferencesFormSchema } from "@/lib/notices/schemas";

export async function markNoticeReadAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionRole();
    const { id } = z.object({ id: noticeIdSchema }).parse(input);
    if (!(await markNoticeRead(getDb(), user.id, id))) return { ok: false, message: "That notice no longer exists." };
    revalidatePath("/notices");
    return { ok: true };
  });
}

export async function markAllNoticesReadAction(): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionRole();
    const marked = await markAllNoticesRead(getDb(), user.id);
    revalidatePath("/notices");
    return { ok: true, message: `${marked} marked read.` };
  });
}

export async function saveEmailPreferencesAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionRole();
    const { shown, email } = preferencesFormSchema.parse(input);
    // Only the events the form showed: an unticked box there means "no e-mail".
    const prefs: Partial<EmailPreferences> = Object.fromEntries(shown.map((e) => [e, email.includes(e)]));
    await setEmailPreferences(getDb(), user.id, prefs);
    revalidatePath("/notices");
    return { ok: true, message: "Saved." };
  });
}
