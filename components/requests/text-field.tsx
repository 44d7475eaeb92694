import { Field, inputClass } from "@/components/ui/field";

/** A labelled input whose error is announced beside it; takes react-hook-form's register() props. */
export function TextField({ id, label, error, hint, className, ...input }: { id: string; label: string; error?: string; hint?: string; className?: string } & React.ComponentProps<"input">) {
  return (
    <Field id={id} label={label} error={error} hint={hint} className={className}>
      <input id={id} className={inputClass} aria-invalid={!!error} aria-describedby={`${id}-error`} {...input} />
    </Field>
  );
}
