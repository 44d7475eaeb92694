"use client";

import Link from "next/link";
import { useMemo, useState, useTransition } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import type { ActionResult } from "@/lib/actions/result";
import { MAX_IMPORT_BYTES } from "@/lib/schedule/import/types";
import { tooLargeMessage } from "@/lib/schedule/import/upload-limits";
import type { ImportCheckView } from "@/lib/schedule/import/view";
import { ImportPreview } from "./import-preview";
import { ImportProblems } from "./import-problems";

type Check = (form: FormData) => Promise<ActionResult<ImportCheckView>>;
type Commit = (form: FormData) => Promise<ActionResult<{ created: number }>>;

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

export function ScheduleImportForm({ check, commit }: { check: Check; commit: Commit }) {
  const [file, setFile] = useState<File | null>(null);
  const [pasted, setPasted] = useState("");
  const [plan, setPlan] = useState<ImportCheckView | null>(null);
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [pending, startTransition] = useTransition();

  // Pasted text travels as a file too, so both take the same path and the same size limit.
  const upload = useMemo(() => file ?? (pasted.trim() ? new File([pasted], "pasted text", { type: "text/plain" }) : null), [file, pasted]);
  const tooLarge = upload && upload.size > MAX_IMPORT_BYTES ? tooLargeMessage(upload.size) : null;
  const ready = plan !== null && plan.problems.length === 0 && plan.toCreate.length > 0;

  // Any change to the input makes the last check stale: the import must match what was checked.
  function changed() {
    setPlan(null);
    setMessage(null);
  }

  function formFor(u: File): FormData {
    const form = new FormData();
    form.append("file", u, u.name);
    return form;
  }

  function runCheck() {
    if (!upload || tooLarge) return;
    startTransition(async () => {
      const answer = await check(formFor(upload));
      setMessage(answer.ok ? null : { tone: "error", text: answer.message });
      setPlan(answer.ok ? (answer.data ?? null) : null);
    });
  }

  function runImport() {
    if (!upload || !ready) return;
    startTransition(async () => {
      const answer = await commit(formFor(upload));
      if (answer.ok) {
        setPlan(null);
        setMessage({ tone: "ok", text: answer.message ?? "Imported." });
        return;
      }
      setMessage({ tone: "error", text: answer.message });
      // The schedule changed since the check: show the up-to-date list of problems.
      const again = await check(formFor(upload));
      setPlan(again.ok ? (again.data ?? null) : null);
    });
  }

  return (
    <div className="flex flex-col gap-6">
      <form
        className="grid gap-x-4 rounded-lg border border-line bg-raised p-4 md:grid-cols-2"
        aria-label="Check a schedule file"
        onSubmit={(e) => {
          e.preventDefault();
          runCheck();
        }}
      >
        <Field id="schedule-file" label="Schedule file" hint={`CSV or iCalendar (.ics), up to ${MAX_IMPORT_BYTES / 1_000_000} MB.`} error={file ? (tooLarge ?? undefined) : undefined}>
          <input
            id="schedule-file"
            type="file"
            accept=".csv,.ics,.ical,.txt,text/csv,text/calendar,text/plain"
            className={inputClass}
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              changed();
            }}
          />
        </Field>
        <Field
          id="schedule-paste"
          label="Or paste the file"
          hint={file ? "A chosen file is used instead of pasted text." : "CSV with a header line, or a calendar starting BEGIN:VCALENDAR."}
          error={!file ? (tooLarge ?? undefined) : undefined}
        >
          <textarea
            id="schedule-paste"
            rows={5}
            spellCheck={false}
            className={`${inputClass} num text-xs`}
            value={pasted}
            onChange={(e) => {
              setPasted(e.target.value);
              changed();
            }}
          />
        </Field>
        <div className="flex flex-wrap items-center gap-3 md:col-span-2">
          <Button type="submit" variant="quiet" disabled={pending || !upload || !!tooLarge}>
            {pending && !plan ? "Checking…" : "Check file"}
          </Button>
          <span className="text-xs text-muted">Checking writes nothing: it shows what an import would create.</span>
        </div>
      </form>

      <div aria-live="polite" className="flex flex-col gap-3">
        {message && <Alert tone={message.tone}>{message.text}{message.tone === "ok" && <> <Link className="underline" href="/schedule">See the schedule</Link>.</>}</Alert>}
        {plan && (
          <Alert tone={plan.problems.length ? "error" : "info"}>
            {plan.fileName} ({plan.format === "ical" ? "iCalendar" : "CSV"}): {plural(plan.toCreate.length, "block")} ready
            {plan.problems.length ? `, ${plural(plan.problems.length, "problem")} to fix. Nothing can be imported until every row is right.` : ", no problems."}
          </Alert>
        )}
      </div>

      {plan && plan.problems.length > 0 && (
        <section>
          <h2 className="mb-2 font-semibold">Problems</h2>
          <ImportProblems problems={plan.problems} />
        </section>
      )}

      {plan && plan.toCreate.length > 0 && (
        <section>
          <div className="mb-2 flex flex-wrap items-center justify-between gap-3">
            <h2 className="font-semibold">{plan.problems.length ? "Rows without problems" : "Blocks to be created"}</h2>
            <Button type="button" onClick={runImport} disabled={pending || !ready}>
              {pending ? "Importing…" : `Import ${plural(plan.toCreate.length, "block")}`}
            </Button>
          </div>
          <ImportPreview rows={plan.toCreate} />
        </section>
      )}
    </div>
  );
}
