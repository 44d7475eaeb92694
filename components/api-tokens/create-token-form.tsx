"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import type { ActionResult } from "@/lib/actions/result";
import { createTokenSchema, type CreateTokenInput } from "@/lib/api-tokens/schemas";

/** Creates a token and shows its secret once, with a copy button; leaving the page forgets it. */
export function CreateTokenForm({ action }: { action: (input: unknown) => Promise<ActionResult<{ secret: string; name: string }>> }) {
  const [created, setCreated] = useState<{ secret: string; name: string } | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CreateTokenInput>({ resolver: zodResolver(createTokenSchema), defaultValues: { name: "" } });

  async function onSubmit(values: CreateTokenInput) {
    setMessage(null);
    setCopied(false);
    let answer: ActionResult<{ secret: string; name: string }>;
    try {
      answer = await action(values);
    } catch {
      answer = { ok: false, message: "The token could not be created: check your connection and try again." };
    }
    if (answer.ok && answer.data) {
      setCreated(answer.data);
      reset({ name: "" });
      return;
    }
    setMessage(answer.message ?? "The token could not be created.");
    if (!answer.ok && answer.fieldErrors?.name) setError("name", { message: answer.fieldErrors.name });
  }

  return (
    <div className="flex flex-col gap-3">
      <form onSubmit={handleSubmit(onSubmit)} noValidate aria-label="Create an API token" className="flex flex-wrap items-start gap-3">
        <Field id="token-name" label="Token name" error={errors.name?.message} hint="What will use it, e.g. “alert pipeline”." className="min-w-64 flex-1">
          <input id="token-name" className={inputClass} autoComplete="off" aria-invalid={!!errors.name} {...register("name")} />
        </Field>
        <Button type="submit" className="mt-5" disabled={isSubmitting}>
          {isSubmitting ? "Creating…" : "Create token"}
        </Button>
      </form>
      {message && <Alert tone="error">{message}</Alert>}
      {created && (
        <div role="status" className="flex flex-col gap-2 rounded-md border border-flare bg-flare-soft p-3 text-sm text-flare-ink">
          <p>
            <strong>Copy the token for “{created.name}” now.</strong> It is shown this once and cannot be shown again; only its first characters are kept.
          </p>
          <div className="flex flex-wrap items-center gap-2">
            <code aria-label="New API token" className="num select-all break-all rounded bg-raised px-2 py-1 text-text">
              {created.secret}
            </code>
            <Button
              type="button"
              variant="quiet"
              onClick={async () => {
                await navigator.clipboard.writeText(created.secret);
                setCopied(true);
              }}
            >
              {copied ? "Copied" : "Copy"}
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
