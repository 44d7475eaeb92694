import { Field, inputClass } from "@/components/ui/field";

type Labelled = { id: string; label: string; error?: string; hint?: string; className?: string };

/** A labelled input whose error is announced beside it; takes react-hook-form's register() props. */
export function FormInput({ id, label, error, hint, className, ...input }: Labelled & React.ComponentProps<"input">) {
  return (
    <Field id={id} label={label} error={error} hint={hint} className={className}>
      <input id={id} className={inputClass} aria-invalid={!!error} aria-describedby={`${id}-error`} {...input} />
    </Field>
  );
}

export interface SelectOption {
  value: string;
  label: string;
}

/** A labelled select with a "Choose…" first option, so nothing is picked by accident. */
export function FormSelect({
  id,
  label,
  error,
  hint,
  className,
  options,
  placeholder = "Choose…",
  ...select
}: Labelled & { options: SelectOption[]; placeholder?: string } & React.ComponentProps<"select">) {
  return (
    <Field id={id} label={label} error={error} hint={hint} className={className}>
      <select id={id} className={inputClass} aria-invalid={!!error} aria-describedby={`${id}-error`} {...select}>
        <option value="">{placeholder}</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </select>
    </Field>
  );
}
