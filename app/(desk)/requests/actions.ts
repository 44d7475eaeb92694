"use server";

import { revalidatePath } from "next/cache";
import { getDb } from "@/db/index";
import { runAction, type ActionResult } from "@/lib/actions/result";
import { requireActionRole } from "@/lib/auth/session";
import { parseRequestId } from "@/lib/requests/api-read";
import { RequestFieldError, RequestNotFoundError, RequestRefusedError, RequestStateError } from "@/lib/requests/errors";
import { draftInputSchema, requestSchema, withdrawSchema } from "@/lib/requests/schemas";
import { fileRequest, saveDraft, withdrawRequest } from "@/lib/requests/service";

const KNOWN = [RequestNotFoundError, RequestStateError];

/** Autosave: creates the draft (id null) or replaces its fields with whatever has been typed. */
export async function saveDraftAction(id: string | null, values: unknown): Promise<ActionResult<{ id: string; savedAt: string }>> {
  return runAction(async () => {
    const user = await requireActionRole("pi");
    const input = draftInputSchema.parse(values);
    const saved = await saveDraft(getDb(), user, id === null ? null : parseRequestId(id), input);
    return { ok: true, data: { id: saved.id, savedAt: saved.updatedAt.toISOString() } };
  }, KNOWN);
}

export type SubmitResult = ActionResult<{ id: string }> | { ok: false; message: string; reasons: string[] };

/** Files the request: the draft `id` if there is one, else a new request. Refusals come back with their reasons. */
export async function submitRequestAction(id: string | null, values: unknown): Promise<SubmitResult> {
  let reasons: string[] | null = null;
  const result = await runAction(async (): Promise<ActionResult<{ id: string }>> => {
    const user = await requireActionRole("pi");
    const input = requestSchema.parse(values);
    const typed = (values as { target?: { ra?: unknown; dec?: unknown } } | null)?.target ?? {};
    const draftId = id === null ? undefined : parseRequestId(id);
    try {
      const filed = await fileRequest(getDb(), user, input, { draftId, source: "form", typed });
      revalidatePath("/requests");
      return { ok: true, message: "Request filed.", data: { id: filed.id } };
    } catch (error) {
      if (error instanceof RequestFieldError) return { ok: false, message: error.message, fieldErrors: error.fields };
      if (error instanceof RequestRefusedError) {
        reasons = error.report.reasons;
        return { ok: false, message: "Not filed: the feasibility check refused this request." };
      }
      throw error;
    }
  }, KNOWN);
  return reasons && !result.ok ? { ok: false, message: result.message, reasons } : result;
}

export async function withdrawRequestAction(id: string, input: unknown): Promise<ActionResult> {
  return runAction(async () => {
    const user = await requireActionRole("pi");
    const { note } = withdrawSchema.parse(input);
    await withdrawRequest(getDb(), user, parseRequestId(id), note);
    revalidatePath("/requests");
    revalidatePath(`/requests/${id}`);
    return { ok: true, message: "Request withdrawn." };
  }, KNOWN);
}
