import { cn } from "@/lib/cn";

export function Alert({ tone = "info", children }: { tone?: "info" | "error" | "ok" | "caution"; children: React.ReactNode }) {
  return (
    <div
      role={tone === "error" ? "alert" : "status"}
      className={cn(
        "rounded-md border px-3 py-2 text-sm",
        tone === "error" && "border-danger text-danger",
        tone === "ok" && "border-ok text-ok",
        tone === "caution" && "border-flare bg-flare-soft text-flare-ink",
        tone === "info" && "border-line bg-sunken text-text",
      )}
    >
      {children}
    </div>
  );
}
