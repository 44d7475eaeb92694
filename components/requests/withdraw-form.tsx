"use client";

import { useRouter } from "next/navigation";
import { useId, useState, useTransition } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import type { ActionResult } from "@/lib/actions/result";

/** Withdrawing asks once more, and takes an optional note for the history. */
export function WithdrawForm({ requestId, action }: { requestId: string; action: (id: string, input: unknown) => Promise<ActionResult> }) {
  const router = useRouter();
  const noteId = useId();
  const [open, setOpen] = useState(false);
  const [note, setNote] = useState("");
  const [result, setResult] = useState<ActionResult | null>(null);
  const [pending, startTransition] = useTransition();

  if (!open) {
    return (
      <Button type="button" variant="danger" onClick={() => setOpen(true)}>
        Withdraw request
      </Button>
    );
  }
  return (
    <form
      aria-label="Withdraw the request"
      className="flex flex-col gap-2 rounded-md border border-danger p-3"
      onSubmit={(e) => {
        e.preventDefault();
        startTransition(async () => {
          const answer = await action(requestId, { note });
          setResult(answer);
          if (answer.ok) router.refresh();
        });
      }}
    >
      <label htmlFor={noteId} className="text-xs font-semibold uppercase tracking-wide text-muted">
        Note for the history (optional)
      </label>
      <input id={noteId} className={inputClass} value={note} maxLength={2000} onChange={(e) => setNote(e.target.value)} />
      <div className="flex gap-2">
        <Button type="submit" variant="danger" disabled={pending}>
          {pending ? "Withdrawing…" : "Confirm withdrawal"}
        </Button>
        <Button type="button" variant="quiet" onClick={() => setOpen(false)}>
          Keep the request
        </Button>
      </div>
      {result && <Alert tone={result.ok ? "ok" : "error"}>{result.message}</Alert>}
    </form>
  );
}
