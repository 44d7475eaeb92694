"use client";

/**
 * Attaching files to the draft: each file is checked in the browser first (size, and
 * content against its name), the draft is saved so the file has a request to belong to,
 * then UploadThing stores it and the server checks the stored bytes again. A refusal is
 * a message beside the attachments; it never touches the form's values.
 */
import { useRef, useState } from "react";
import type { AttachmentKind } from "@/db/types";
import { checkAttachment, checkSize } from "@/lib/attachments/check";
import type { StoredAttachment } from "@/lib/attachments/router";
import { describeUploadError } from "@/lib/attachments/upload-errors";
import { useUploadThing } from "./uploads";

export interface UploadProblem {
  id: number;
  text: string;
}

let problemIds = 0;

export function useAttachmentUpload({ initial, ensureDraft }: { initial: StoredAttachment[]; ensureDraft: () => Promise<string | null> }) {
  const [attachments, setAttachments] = useState<StoredAttachment[]>(initial);
  const [problems, setProblems] = useState<UploadProblem[]>([]);
  const [busy, setBusy] = useState<string[]>([]);
  const lastError = useRef<unknown>(null);
  const { startUpload } = useUploadThing("requestAttachment", {
    onUploadError: (error) => {
      lastError.current = error;
    },
  });

  const refuse = (text: string): false => {
    setProblems((list) => [...list, { id: ++problemIds, text }]);
    return false;
  };
  const dismiss = (id: number) => setProblems((list) => list.filter((p) => p.id !== id));

  /** Stores one file; true when it was accepted. */
  async function upload(file: File, kind: AttachmentKind): Promise<boolean> {
    const sized = checkSize(file.name, file.size);
    if (sized && !sized.ok) return refuse(sized.reason);
    const verdict = checkAttachment(file.name, new Uint8Array(await file.arrayBuffer()));
    if (!verdict.ok) return refuse(verdict.reason);
    setBusy((list) => [...list, verdict.fileName]);
    try {
      const requestId = await ensureDraft();
      if (!requestId) return refuse(`“${verdict.fileName}” was not sent: the draft could not be saved first. Try again in a moment.`);
      lastError.current = null;
      // The cleaned name travels with the file; the server cleans it again anyway.
      const named = new File([file], verdict.fileName, { type: verdict.contentType });
      const results = await startUpload([named], { requestId, kind });
      const answer = results?.[0]?.serverData;
      if (!answer) return refuse(describeUploadError(lastError.current));
      if (!answer.ok) return refuse(answer.reason);
      setAttachments((list) => [...list, answer.attachment]);
      return true;
    } catch (error) {
      return refuse(describeUploadError(error));
    } finally {
      setBusy((list) => list.filter((name) => name !== verdict.fileName));
    }
  }

  return { attachments, problems, busy, upload, dismiss };
}
