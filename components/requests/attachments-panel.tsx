"use client";

import { useId, useState } from "react";
import { ATTACHMENT_KINDS, type AttachmentKind } from "@/db/types";
import { ACCEPTED_EXTENSIONS, MAX_ATTACHMENT_LABEL } from "@/lib/attachments/content";
import { inputClass } from "@/components/ui/field";
import { ATTACHMENT_KIND_LABELS } from "@/lib/requests/labels";
import { AttachmentList } from "./attachment-list";
import type { useAttachmentUpload } from "./use-attachment-upload";

type Uploads = ReturnType<typeof useAttachmentUpload>;

/** Finding charts, justification documents and other files for the draft. */
export function AttachmentsPanel({ uploads, disabled }: { uploads: Uploads; disabled?: boolean }) {
  const [kind, setKind] = useState<AttachmentKind>("finding_chart");
  const kindId = useId();
  const fileId = useId();
  return (
    <fieldset className="flex flex-col gap-2" aria-describedby={`${fileId}-hint`}>
      <legend className="mb-1 text-sm font-semibold">Attachments</legend>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={kindId} className="text-xs font-semibold uppercase tracking-wide text-muted">
            Attachment kind
          </label>
          <select id={kindId} className={inputClass} value={kind} onChange={(e) => setKind(e.target.value as AttachmentKind)} disabled={disabled}>
            {ATTACHMENT_KINDS.map((k) => (
              <option key={k} value={k}>
                {ATTACHMENT_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={fileId} className="text-xs font-semibold uppercase tracking-wide text-muted">
            Attach a file
          </label>
          <input
            id={fileId}
            type="file"
            multiple
            accept={ACCEPTED_EXTENSIONS.join(",")}
            disabled={disabled}
            className="text-sm file:mr-3 file:rounded-md file:border file:border-line file:bg-raised file:px-3 file:py-1.5 file:text-sm"
            onChange={async (e) => {
              const input = e.currentTarget;
              const files = [...(input.files ?? [])];
              input.value = "";
              for (const file of files) await uploads.upload(file, kind);
            }}
          />
        </div>
      </div>
      <p id={`${fileId}-hint`} className="text-xs text-muted">
        PDF, PNG, JPEG, FITS, CSV or plain text, at most {MAX_ATTACHMENT_LABEL} each; checked by content as well as by name.
      </p>
      {uploads.busy.length > 0 && (
        <p role="status" className="text-xs text-muted">
          Uploading {uploads.busy.join(", ")}…
        </p>
      )}
      {uploads.problems.map((p) => (
        <div key={p.id} role="alert" className="flex items-start justify-between gap-3 rounded-md border border-danger px-3 py-2 text-sm text-danger">
          <span>{p.text}</span>
          <button type="button" className="text-xs underline" onClick={() => uploads.dismiss(p.id)}>
            Dismiss
          </button>
        </div>
      ))}
      <AttachmentList items={uploads.attachments} />
    </fieldset>
  );
}
