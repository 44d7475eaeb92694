import { cn } from "@/lib/cn";

/** A labelled control with its error message announced beside it. */
export function Field({
  id,
  label,
  error,
  hint,
  children,
  className,
}: {
  id: string;
  label: string;
  error?: string;
  hint?: string;
  children: React.ReactNode;
  className?: string;
}) {
  return (
    <div className={cn("flex flex-col gap-1", className)}>
      <label htmlFor={id} className="text-xs font-semibold uppercase tracking-wide text-muted">
        {label}
      </label>
      {children}
      {hint && !error && <p className="text-xs text-muted">{hint}</p>}
      <p id={`${id}-error`} aria-live="polite" className="min-h-4 text-xs text-danger">
        {error}
      </p>
    </div>
  );
}

export const inputClass =
  "w-full rounded-md border border-line bg-raised px-2.5 py-1.5 text-sm text-text placeholder:text-muted aria-[invalid=true]:border-danger";
