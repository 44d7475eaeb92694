"use client";

import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/actions/result";
import { Button } from "@/components/ui/button";

export interface PreferenceOption {
  event: string;
  label: string;
  email: boolean;
}

/** Which notices also arrive by e-mail. In-app notices always arrive. */
export function PreferencesForm({ options, save }: { options: PreferenceOption[]; save: (input: unknown) => Promise<ActionResult> }) {
  const [checked, setChecked] = useState(() => new Set(options.filter((o) => o.email).map((o) => o.event)));
  const [result, setResult] = useState<ActionResult | null>(null);
  const [pending, startTransition] = useTransition();

  function toggle(event: string, on: boolean) {
    const next = new Set(checked);
    if (on) next.add(event);
    else next.delete(event);
    setChecked(next);
  }

  return (
    <form
      onSubmit={(e) => {
        e.preventDefault();
        startTransition(async () => setResult(await save({ shown: options.map((o) => o.event), email: [...checked] })));
      }}
    >
      <fieldset className="grid gap-2">
        <legend className="mb-2 text-sm text-muted">Send me an e-mail when…</legend>
        {options.map((o) => (
          <label key={o.event} className="flex items-center gap-2 text-sm">
            <input type="checkbox" name="email" value={o.event} checked={checked.has(o.event)} onChange={(e) => toggle(o.event, e.target.checked)} />
            {o.label}
          </label>
        ))}
      </fieldset>
      <div className="mt-3 flex items-center gap-3">
        <Button type="submit" disabled={pending}>
          Save e-mail preferences
        </Button>
        <p aria-live="polite" className={result && !result.ok ? "text-sm text-danger" : "text-sm text-ok"}>
          {result?.message}
        </p>
      </div>
    </form>
  );
}
