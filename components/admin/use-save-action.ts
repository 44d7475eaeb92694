"use client";

import { useState } from "react";
import { type DefaultValues, type FieldValues, type Path, type Resolver, useForm, type UseFormSetError } from "react-hook-form";
import type { ActionResult } from "@/lib/actions/result";

const UNEXPECTED: ActionResult = {
  ok: false,
  message: "Something went wrong on our side and nothing was saved. Your entries are still here: try again.",
};

/**
 * Sends the form's values to a server action and shows its answer: field errors beside
 * their fields, one message below. The form keeps what was typed unless the save worked.
 */
export function useSaveAction<V extends FieldValues>(save: (values: V) => Promise<ActionResult>, setError: UseFormSetError<V>, onSaved: (values: V) => void) {
  const [result, setResult] = useState<ActionResult | null>(null);

  async function submit(values: V) {
    let answer: ActionResult;
    try {
      answer = await save(values);
    } catch {
      answer = UNEXPECTED;
    }
    setResult(answer);
    if (answer.ok) onSaved(values);
    else for (const [field, message] of Object.entries(answer.fieldErrors ?? {})) setError(field as Path<V>, { type: "server", message });
  }

  return { result, submit };
}

/**
 * An editor's form (react-hook-form) wired to its save action: `id` null creates a new
 * record and empties the form after saving; otherwise it edits and keeps what was saved.
 */
export function useEditorForm<V extends FieldValues>({
  id,
  initial,
  empty,
  resolver,
  action,
}: {
  id: string | null;
  initial: V;
  empty: V;
  resolver: Resolver<V>;
  action: (id: string | null, input: unknown) => Promise<ActionResult>;
}) {
  const form = useForm<V>({ resolver, defaultValues: initial as DefaultValues<V> });
  const { result, submit } = useSaveAction<V>((v) => action(id, v), form.setError, (v) => form.reset(id ? v : empty));
  return { ...form, result, onSubmit: form.handleSubmit(submit) };
}
