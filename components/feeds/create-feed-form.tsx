"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import type { FeedScope } from "@/db/types";
import type { ActionResult } from "@/lib/actions/result";
import type { FeedTargets } from "@/lib/calendar-feeds/queries";
import { createFeedSchema, type CreateFeedInput } from "@/lib/calendar-feeds/schemas";
import { FeedUrl } from "./feed-url";

const SCOPES: Array<{ value: FeedScope; label: string }> = [
  { value: "observer", label: "My observer blocks" },
  { value: "telescope", label: "A telescope" },
  { value: "program", label: "A program" },
];

export function CreateFeedForm({
  userId,
  targets,
  action,
}: {
  userId: string;
  targets: FeedTargets;
  action: (input: unknown) => Promise<ActionResult<{ path: string; label: string }>>;
}) {
  const [result, setResult] = useState<ActionResult<{ path: string; label: string }> | null>(null);
  const {
    register,
    handleSubmit,
    watch,
    setValue,
    formState: { errors, isSubmitting },
  } = useForm<CreateFeedInput>({ resolver: zodResolver(createFeedSchema), defaultValues: { scope: "observer", scopeId: userId } });
  const scope = watch("scope");
  const scopeField = register("scope");

  async function onSubmit(values: CreateFeedInput) {
    setResult(null);
    setResult(await action(values));
  }

  const created = result?.ok ? result.data : undefined;
  return (
    <div className="flex flex-col gap-4">
      <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-x-4 sm:grid-cols-2" aria-label="Create a calendar feed">
        <fieldset className="flex flex-col gap-1">
          <legend className="text-xs font-semibold uppercase tracking-wide text-muted">Follow</legend>
          <div className="flex flex-wrap gap-x-4 gap-y-1 pt-1">
            {SCOPES.map((s) => (
              <label key={s.value} className="flex items-center gap-1.5">
                <input
                  type="radio"
                  value={s.value}
                  defaultChecked={s.value === "observer"}
                  {...scopeField}
                  onChange={(e) => {
                    void scopeField.onChange(e);
                    setValue("scopeId", s.value === "observer" ? userId : "");
                  }}
                />
                {s.label}
              </label>
            ))}
          </div>
        </fieldset>
        {scope === "telescope" && (
          <Field id="feed-telescope" label="Telescope" error={errors.scopeId?.message}>
            <select id="feed-telescope" className={inputClass} aria-invalid={!!errors.scopeId} {...register("scopeId")}>
              <option value="">Choose a telescope</option>
              {targets.telescopes.map((t) => (
                <option key={t.id} value={t.id}>{t.code} — {t.name}</option>
              ))}
            </select>
          </Field>
        )}
        {scope === "program" && (
          <Field id="feed-program" label="Program" error={errors.scopeId?.message}>
            <select id="feed-program" className={inputClass} aria-invalid={!!errors.scopeId} {...register("scopeId")}>
              <option value="">Choose a program</option>
              {targets.programs.map((p) => (
                <option key={p.id} value={p.id}>{p.code} — {p.title}</option>
              ))}
            </select>
          </Field>
        )}
        <div className="flex items-center gap-3 sm:col-span-2">
          <Button type="submit" disabled={isSubmitting}>{isSubmitting ? "Creating…" : "Create feed"}</Button>
          {result && !result.ok && <Alert tone="error">{result.message}</Alert>}
        </div>
      </form>
      {created && <FeedUrl path={created.path} label={created.label} />}
    </div>
  );
}
