"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import type { ActionResult } from "@/lib/actions/result";
import { ROLE_LABELS, ROLES } from "@/lib/auth/roles";
import { createUserSchema, type CreateUserInput } from "@/lib/users/schemas";

export function CreateUserForm({ action }: { action: (input: unknown) => Promise<ActionResult> }) {
  const [result, setResult] = useState<ActionResult | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<CreateUserInput>({ resolver: zodResolver(createUserSchema), defaultValues: { roles: [] } });

  async function onSubmit(values: CreateUserInput) {
    const answer = await action(values);
    setResult(answer);
    if (answer.ok) reset({ name: "", email: "", password: "", roles: [] });
    else for (const [field, message] of Object.entries(answer.fieldErrors ?? {})) setError(field as keyof CreateUserInput, { message });
  }

  return (
    <form onSubmit={handleSubmit(onSubmit)} noValidate className="grid gap-x-4 sm:grid-cols-2" aria-label="Create a user">
      <Field id="new-name" label="Name" error={errors.name?.message}>
        <input id="new-name" className={inputClass} aria-invalid={!!errors.name} {...register("name")} />
      </Field>
      <Field id="new-email" label="E-mail" error={errors.email?.message}>
        <input id="new-email" type="email" className={inputClass} aria-invalid={!!errors.email} {...register("email")} />
      </Field>
      <Field id="new-password" label="First password" error={errors.password?.message} hint="At least 12 characters; the person can change it later.">
        <input id="new-password" type="password" autoComplete="new-password" className={inputClass} aria-invalid={!!errors.password} {...register("password")} />
      </Field>
      <fieldset className="flex flex-col gap-1">
        <legend className="text-xs font-semibold uppercase tracking-wide text-muted">Roles</legend>
        <div className="flex flex-wrap gap-x-4 gap-y-1 pt-1">
          {ROLES.map((role) => (
            <label key={role} className="flex items-center gap-1.5">
              <input type="checkbox" value={role} {...register("roles")} />
              {ROLE_LABELS[role]}
            </label>
          ))}
        </div>
        <p aria-live="polite" className="min-h-4 text-xs text-danger">{errors.roles?.message}</p>
      </fieldset>
      <div className="flex items-center gap-3 sm:col-span-2">
        <Button type="submit" disabled={isSubmitting}>{isSubmitting ? "Creating…" : "Create user"}</Button>
        {result && <Alert tone={result.ok ? "ok" : "error"}>{result.message}</Alert>}
      </div>
    </form>
  );
}
