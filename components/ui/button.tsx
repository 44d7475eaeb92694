import { cn } from "@/lib/cn";

const VARIANTS = {
  primary: "bg-text text-surface hover:opacity-90",
  flare: "bg-flare text-black hover:brightness-105",
  quiet: "border border-line bg-raised text-text hover:bg-sunken",
  danger: "border border-danger text-danger hover:bg-sunken",
} as const;

export type ButtonVariant = keyof typeof VARIANTS;

export function buttonClass(variant: ButtonVariant = "primary", extra?: string): string {
  return cn(
    "inline-flex items-center justify-center gap-2 rounded-md px-3 py-1.5 text-sm font-medium transition disabled:cursor-not-allowed disabled:opacity-50",
    VARIANTS[variant],
    extra,
  );
}

export function Button({
  variant,
  className,
  ...props
}: React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: ButtonVariant }) {
  return <button className={buttonClass(variant, className)} {...props} />;
}
