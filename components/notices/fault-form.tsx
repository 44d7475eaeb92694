"use client";

import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/actions/result";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";

export interface FaultSettings {
  failRate: number;
  failStatus: 500 | 429;
  failMode: "before-store" | "after-store";
}

const RATES = [0, 0.1, 0.3, 0.5, 1];

/** The e-mail fake's fault injection: what share of sends fail, how, and when. */
export function FaultForm({ initial, save }: { initial: FaultSettings; save: (input: unknown) => Promise<ActionResult> }) {
  const [values, setValues] = useState(initial);
  const [result, setResult] = useState<ActionResult | null>(null);
  const [pending, startTransition] = useTransition();
  return (
    <form
      className="flex flex-wrap items-start gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        startTransition(async () => setResult(await save(values)));
      }}
    >
      <Field id="fault-rate" label="Fail rate">
        <select id="fault-rate" className={inputClass} value={values.failRate} onChange={(e) => setValues({ ...values, failRate: Number(e.target.value) })}>
          {RATES.map((r) => (
            <option key={r} value={r}>
              {Math.round(r * 100)} %
            </option>
          ))}
        </select>
      </Field>
      <Field id="fault-status" label="Answer">
        <select id="fault-status" className={inputClass} value={values.failStatus} onChange={(e) => setValues({ ...values, failStatus: e.target.value === "429" ? 429 : 500 })}>
          <option value={500}>500 server error</option>
          <option value={429}>429 rate limited</option>
        </select>
      </Field>
      <Field id="fault-mode" label="When">
        <select
          id="fault-mode"
          className={inputClass}
          value={values.failMode}
          onChange={(e) => setValues({ ...values, failMode: e.target.value === "after-store" ? "after-store" : "before-store" })}
        >
          <option value="before-store">before storing (message lost)</option>
          <option value="after-store">after storing (answer lost)</option>
        </select>
      </Field>
      <div className="flex items-center gap-3 pt-5">
        <Button type="submit" disabled={pending}>
          Apply
        </Button>
        <p aria-live="polite" className={result && !result.ok ? "text-sm text-danger" : "text-sm text-ok"}>
          {result?.message}
        </p>
      </div>
    </form>
  );
}
