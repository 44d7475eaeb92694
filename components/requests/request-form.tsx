"use client";

/**
 * The ToO request form, one component for a new request and a draft being continued. It
 * saves the draft as the PI types, shows live feasibility beside the fields, attaches
 * files, and files the request. Every refusal (a field, an upload, the feasibility check)
 * is shown where it belongs and leaves what was typed in place.
 */
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useCallback, useEffect, useState } from "react";
import { useForm, useWatch, type Path } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import type { ActionResult } from "@/lib/actions/result";
import type { StoredAttachment } from "@/lib/attachments/router";
import type { InstrumentOption, ProgramOption } from "@/lib/requests/reference-queries";
import { requestSchema, type RequestFormValues } from "@/lib/requests/schemas";
import { formatUt } from "@/lib/time/format";
import { AttachmentsPanel } from "./attachments-panel";
import { ConstraintsSection } from "./constraints-section";
import { FeasibilityPanel } from "./feasibility-panel";
import type { TelescopeOption } from "./form-types";
import { TargetSection } from "./target-section";
import { TelescopeSection } from "./telescope-section";
import { useAttachmentUpload } from "./use-attachment-upload";
import { useAutosave, type AutosaveStatus } from "./use-autosave";
import { WindowSection } from "./window-section";

type SaveDraft = (id: string | null, values: unknown) => Promise<ActionResult<{ id: string; savedAt: string }>>;
type Submit = (id: string | null, values: unknown) => Promise<ActionResult<{ id: string }> | { ok: false; message: string; reasons: string[] }>;

function DraftStatus({ status }: { status: AutosaveStatus }) {
  const text =
    status.kind === "saved"
      ? `Draft saved at ${formatUt(new Date(status.at)).slice(11)} UT`
      : status.kind === "saving" || status.kind === "pending"
        ? "Saving draft…"
        : status.kind === "error"
          ? status.message
          : "Drafts save as you type.";
  return (
    <p aria-live="polite" className={status.kind === "error" ? "text-xs text-danger" : "text-xs text-muted"}>
      {text}
    </p>
  );
}

export function RequestForm({
  draftId,
  initial,
  programs,
  telescopes,
  instruments,
  attachments,
  saveDraft,
  submit,
}: {
  draftId: string | null;
  initial: RequestFormValues;
  programs: ProgramOption[];
  telescopes: TelescopeOption[];
  instruments: InstrumentOption[];
  attachments: StoredAttachment[];
  saveDraft: SaveDraft;
  submit: Submit;
}) {
  const router = useRouter();
  const form = useForm<RequestFormValues>({ resolver: zodResolver(requestSchema, undefined, { raw: true }), defaultValues: initial });
  const [result, setResult] = useState<{ message: string; reasons: string[]; ok: boolean } | null>(null);

  const onCreated = useCallback((id: string) => {
    // The draft now has an address: reloading the page continues it.
    window.history.replaceState(null, "", `/requests/${id}`);
  }, []);
  const autosave = useAutosave<RequestFormValues>({ initialId: draftId, save: saveDraft, getValues: form.getValues, onCreated });
  const uploads = useAttachmentUpload({ initial: attachments, ensureDraft: autosave.flush });

  const { watch } = form;
  const { schedule } = autosave;
  useEffect(() => {
    const subscription = watch(() => schedule());
    return () => subscription.unsubscribe();
  }, [watch, schedule]);

  const values = useWatch({ control: form.control });

  const onSubmit = form.handleSubmit(async (raw) => {
    setResult(null);
    const id = await autosave.flush();
    let answer: Awaited<ReturnType<Submit>>;
    try {
      answer = await submit(id, raw);
    } catch {
      answer = { ok: false, message: "The request could not be sent: check your connection. Everything you typed is still here." };
    }
    if (answer.ok && answer.data) {
      autosave.stop();
      setResult({ ok: true, message: "Request filed. Opening it…", reasons: [] });
      router.push(`/requests/${answer.data.id}`);
      router.refresh();
      return;
    }
    setResult({ ok: false, message: answer.message ?? "Not filed.", reasons: "reasons" in answer ? answer.reasons : [] });
    if ("fieldErrors" in answer) {
      for (const [field, message] of Object.entries(answer.fieldErrors ?? {})) form.setError(field as Path<RequestFormValues>, { type: "server", message });
    }
  });

  const errors = form.formState.errors;
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
      <form onSubmit={onSubmit} noValidate aria-label="ToO request" className="flex flex-col gap-6 rounded-lg border border-line bg-raised p-4">
        <TargetSection form={form} programs={programs} attachEphemeris={(file) => uploads.upload(file, "ephemeris")} />
        <TelescopeSection form={form} telescopes={telescopes} instruments={instruments} />
        <WindowSection form={form} />
        <ConstraintsSection form={form} />
        <Field id="request-justification" label="Scientific justification" error={errors.justification?.message} hint="Why now, and what the observation will show. Attach a PDF for more.">
          <textarea id="request-justification" rows={6} className={inputClass} aria-invalid={!!errors.justification} {...form.register("justification")} />
        </Field>
        <AttachmentsPanel uploads={uploads} />
        <div className="flex flex-col gap-2 border-t border-line pt-4">
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" variant="flare" disabled={form.formState.isSubmitting}>
              {form.formState.isSubmitting ? "Checking and filing…" : "Submit request"}
            </Button>
            <DraftStatus status={autosave.status} />
          </div>
          <p className="text-xs text-muted">Filing runs the feasibility check again; once filed, the request can only be withdrawn.</p>
          {result &&
            (result.ok ? (
              <Alert tone="ok">{result.message}</Alert>
            ) : (
              <div role="alert" className="rounded-md border border-danger px-3 py-2 text-sm text-danger">
                <p className="font-semibold">{result.message}</p>
                {result.reasons.length > 0 && (
                  <ul className="mt-1 list-disc pl-5">
                    {result.reasons.map((r) => (
                      <li key={r}>{r}</li>
                    ))}
                  </ul>
                )}
              </div>
            ))}
        </div>
      </form>
      <div className="lg:sticky lg:top-4 lg:self-start">
        <FeasibilityPanel values={values} targetName={values.targetName ?? ""} />
      </div>
    </div>
  );
}
