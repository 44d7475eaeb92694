"use client";

/**
 * The three decisions. Approve takes the slot chosen above (and an optional note);
 * decline needs a reason and return needs a note for the PI — checked with the same
 * schemas as the server, so a missing reason is shown beside its box before anything is sent.
 */
import { useState, useTransition } from "react";
import type { z } from "zod";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import type { ActionResult } from "@/lib/actions/result";
import { declineDecisionSchema, returnDecisionSchema } from "@/lib/review/schemas";

export type DecideAction = (requestId: string, values: unknown) => Promise<ActionResult<{ state: string }>>;

export function ApproveForm({ disabled, pending, onApprove }: { disabled: boolean; pending: boolean; onApprove: (note: string) => void }) {
  const [note, setNote] = useState("");
  return (
    <form
      aria-label="Approve"
      className="flex flex-col gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        onApprove(note);
      }}
    >
      <Field id="approve-note" label="Note to the PI (optional)">
        <input id="approve-note" className={inputClass} value={note} maxLength={4000} onChange={(e) => setNote(e.target.value)} />
      </Field>
      <Button type="submit" variant="flare" disabled={disabled || pending}>
        {pending ? "Approving…" : "Approve this slot"}
      </Button>
    </form>
  );
}

const declineForm = declineDecisionSchema.omit({ decision: true });
const returnForm = returnDecisionSchema.omit({ decision: true });

function TextDecision({
  schema,
  field,
  label,
  button,
  decision,
  requestId,
  action,
  onDone,
}: {
  schema: z.ZodType;
  field: "reason" | "note";
  label: string;
  button: string;
  decision: "decline" | "return";
  requestId: string;
  action: DecideAction;
  onDone: (result: ActionResult<{ state: string }>) => void;
}) {
  const [text, setText] = useState("");
  const [error, setError] = useState<string>();
  const [pending, startTransition] = useTransition();
  const id = `${decision}-${field}`;
  return (
    <form
      aria-label={button}
      className="flex flex-col gap-2"
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        const parsed = schema.safeParse({ [field]: text });
        if (!parsed.success) return setError(parsed.error.issues[0]?.message);
        setError(undefined);
        startTransition(async () => {
          const result = await action(requestId, { decision, [field]: text });
          if (!result.ok) setError(result.fieldErrors?.[field]);
          onDone(result);
        });
      }}
    >
      <Field id={id} label={label} error={error}>
        <textarea id={id} rows={2} className={inputClass} aria-invalid={!!error} aria-describedby={`${id}-error`} value={text} maxLength={4000} onChange={(e) => setText(e.target.value)} />
      </Field>
      <Button type="submit" variant={decision === "decline" ? "danger" : "quiet"} disabled={pending}>
        {pending ? "Sending…" : button}
      </Button>
    </form>
  );
}

export function DeclineForm(props: { requestId: string; action: DecideAction; onDone: (r: ActionResult<{ state: string }>) => void }) {
  return <TextDecision schema={declineForm} field="reason" label="Reason for declining" button="Decline" decision="decline" {...props} />;
}

export function ReturnForm(props: { requestId: string; action: DecideAction; onDone: (r: ActionResult<{ state: string }>) => void }) {
  return <TextDecision schema={returnForm} field="note" label="What the PI should change" button="Return to PI" decision="return" {...props} />;
}

export function ResultMessage({ result }: { result: ActionResult<{ state: string }> | null }) {
  if (!result) return null;
  return <Alert tone={result.ok ? "ok" : "error"}>{result.message ?? (result.ok ? "Done." : "Not done.")}</Alert>;
}
