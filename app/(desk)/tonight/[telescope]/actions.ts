"use server";

import { z } from "zod";
import { getDb } from "@/db/index";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { acknowledgeChanges } from "@/lib/tonight/acknowledge";
import { logExecution } from "@/lib/tonight/execution-log";
import { OUTCOME_LABELS } from "@/lib/tonight/labels";
import { acknowledgeSchema, executionLogSchema, telescopeRefSchema } from "@/lib/tonight/schemas";

const acknowledgeActionSchema = acknowledgeSchema.extend({ telescope: telescopeRefSchema });

export async function acknowledgeChangesAction(input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionRole("night_assistant", "admin");
    const { telescope, throughChangeId } = acknowledgeActionSchema.parse(input);
    await acknowledgeChanges(getDb(), user, telescope, { throughChangeId });
    return { ok: true, message: "Changes acknowledged." };
  });
}

export async function logExecutionAction(input: unknown): Promise<ActionResult> {
  return runFormAction(async () => {
    const user = await requireActionRole("night_assistant", "admin");
    const blockId = parseRecordId(z.object({ blockId: z.unknown() }).parse(input).blockId, "block");
    const values = executionLogSchema.parse(input);
    const logged = await logExecution(getDb(), user, blockId, values);
    const settled = logged.request ? ` The request is now ${logged.request.to.replace("_", " ")}.` : "";
    return { ok: true, message: `Logged: ${OUTCOME_LABELS[values.outcome].toLowerCase()}.${settled}` };
  });
}
