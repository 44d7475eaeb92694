import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import type { ActionResult } from "@/lib/actions/result";

export function FormFooter({ submitLabel, pending, result }: { submitLabel: string; pending: boolean; result: ActionResult | null }) {
  return (
    <div className="col-span-full flex flex-wrap items-center gap-3">
      <Button type="submit" disabled={pending}>
        {pending ? "Saving…" : submitLabel}
      </Button>
      {result && <Alert tone={result.ok ? "ok" : "error"}>{result.message}</Alert>}
    </div>
  );
}
