import { cn } from "@/lib/cn";

export interface CheckboxOption {
  value: string;
  label: string;
}

/** A labelled group of checkboxes for choosing several people or things; the value is the chosen list. */
export function CheckboxList({
  legend,
  options,
  value,
  onChange,
  error,
  hint,
  empty = "No one to choose from yet.",
  className,
}: {
  legend: string;
  options: CheckboxOption[];
  value: readonly string[];
  onChange: (next: string[]) => void;
  error?: string;
  hint?: string;
  empty?: string;
  className?: string;
}) {
  const toggle = (option: string, on: boolean) => onChange(on ? [...value, option] : value.filter((v) => v !== option));
  return (
    <fieldset className={cn("flex flex-col gap-1", className)}>
      <legend className="text-xs font-semibold uppercase tracking-wide text-muted">{legend}</legend>
      {options.length === 0 ? (
        <p className="pt-1 text-sm text-muted">{empty}</p>
      ) : (
        <div className="flex flex-wrap gap-x-4 gap-y-1 pt-1">
          {options.map((o) => (
            <label key={o.value} className="flex items-center gap-1.5 text-sm">
              <input type="checkbox" checked={value.includes(o.value)} onChange={(e) => toggle(o.value, e.target.checked)} />
              {o.label}
            </label>
          ))}
        </div>
      )}
      {hint && !error && <p className="text-xs text-muted">{hint}</p>}
      <p aria-live="polite" className="min-h-4 text-xs text-danger">
        {error}
      </p>
    </fieldset>
  );
}
