"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { runFormAction } from "@/lib/actions/form-action";
import type { ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { PaybackOutsideNightError, schedulePayback } from "@/lib/ledger/payback";
import { paybackSchema } from "@/lib/ledger/schemas";
import { BlockConflictError } from "@/lib/schedule/service";
import { formatDuration } from "@/lib/time/format";

export async function schedulePaybackAction(input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const actor = await requireActionRole("director", "admin");
    const values = paybackSchema.parse(input);
    try {
      const result = await schedulePayback(getDb(), actor, values);
      revalidatePath("/ledger");
      revalidatePath("/schedule");
      return { ok: true, message: `Payback block of ${formatDuration(result.minutes)} scheduled; still owed ${formatDuration(Math.max(0, result.owedAfterMinutes))}.` };
    } catch (error) {
      if (error instanceof BlockConflictError) return { ok: false, message: error.message, fieldErrors: { startsAt: "Overlaps another block." } };
      if (error instanceof PaybackOutsideNightError) return { ok: false, message: error.message, fieldErrors: Object.fromEntries(error.fields.map((f) => [f, error.message])) };
      throw error;
    }
  });
}
