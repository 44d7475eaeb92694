"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { parseRecordId } from "@/lib/actions/form-action";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { DecisionError } from "@/lib/decisions/errors";
import { decide } from "@/lib/review/decide";
import { decisionSchema } from "@/lib/review/schemas";
import { formatDuration } from "@/lib/time/format";

const DONE = {
  approve: "Approved: the override is on the schedule and everyone affected has been told.",
  decline: "Declined: the PI has been told why.",
  return: "Returned to the PI with your note.",
} as const;

/** Approve, decline or return; a slot taken meanwhile comes back as the SlotTakenError message. */
export async function decideAction(requestId: string, values: unknown): Promise<ActionResult<{ state: string }>> {
  return runAction(async () => {
    const director = await requireActionRole("director");
    const id = parseRecordId(requestId, "request");
    const input = decisionSchema.parse(values);
    const outcome = await decide(getDb(), director, id, input);
    revalidatePath("/review");
    revalidatePath(`/review/${id}`);
    const displaced = outcome.decision === "approve" && outcome.displacedMinutes > 0 ? ` ${formatDuration(outcome.displacedMinutes)} displaced.` : "";
    return { ok: true, message: `${DONE[outcome.decision]}${displaced}`, data: { state: outcome.state } };
  }, [DecisionError]);
}
