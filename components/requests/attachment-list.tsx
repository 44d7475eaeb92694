import type { AttachmentKind } from "@/db/types";
import { ATTACHMENT_KIND_LABELS } from "@/lib/requests/labels";

export interface AttachmentItem {
  id: string;
  kind: AttachmentKind;
  fileName: string;
  sizeBytes: number;
  url: string;
}

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${(n / 1024).toFixed(1)} kB`;
  return `${(n / 1024 / 1024).toFixed(1)} MB`;
}

export function AttachmentList({ items, empty = "No files attached." }: { items: AttachmentItem[]; empty?: string }) {
  if (items.length === 0) return <p className="text-sm text-muted">{empty}</p>;
  return (
    <ul aria-label="Attached files" className="divide-y divide-line rounded-md border border-line">
      {items.map((a) => (
        <li key={a.id} className="flex flex-wrap items-baseline gap-x-3 px-3 py-1.5 text-sm">
          <a href={a.url} target="_blank" rel="noopener noreferrer" className="underline">
            {a.fileName}
          </a>
          <span className="text-xs text-muted">{ATTACHMENT_KIND_LABELS[a.kind]}</span>
          <span className="num ml-auto text-xs text-muted">{formatBytes(a.sizeBytes)}</span>
        </li>
      ))}
    </ul>
  );
}
