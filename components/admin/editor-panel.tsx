import Link from "next/link";
import { Alert } from "@/components/ui/alert";

/**
 * The box above an admin table holding its one form: "New site" or "Edit site AQS".
 * `notice` explains why an edit link led back to the new form (the record was deleted).
 */
export function EditorPanel({ title, cancelHref, notice, children }: { title: string; cancelHref?: string; notice?: string; children: React.ReactNode }) {
  return (
    <section aria-labelledby="editor-heading" className="mb-8 rounded-lg border border-line bg-raised p-4">
      <div className="mb-3 flex flex-wrap items-baseline justify-between gap-3">
        <h2 id="editor-heading" className="font-semibold">
          {title}
        </h2>
        {cancelHref && (
          <Link href={cancelHref} className="text-sm text-muted underline hover:text-text">
            Stop editing
          </Link>
        )}
      </div>
      {notice && (
        <div className="mb-3">
          <Alert tone="caution">{notice}</Alert>
        </div>
      )}
      {children}
    </section>
  );
}
