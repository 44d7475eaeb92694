/**
 * The one rule for accepting an attachment, run in the browser before sending and on the
 * server against the stored copy: at most 20 MB, an accepted kind by content, and a name
 * that does not claim to be something else ("chart.png" holding text is refused). A name
 * without a known ending gets the ending of what the content is.
 */
import { FAMILY_INFO, familyOfName, MAX_ATTACHMENT_BYTES, MAX_ATTACHMENT_LABEL, sniffContent } from "./content";
import { sanitizeFileName } from "./names";

export type AttachmentVerdict = { ok: true; fileName: string; contentType: string } | { ok: false; fileName: string; reason: string };

/** Checks the size alone: what can be refused before any byte is read or sent. */
export function checkSize(name: string, size: number): AttachmentVerdict | null {
  const fileName = sanitizeFileName(name);
  if (size <= 0) return { ok: false, fileName, reason: `“${fileName}” is empty.` };
  if (size > MAX_ATTACHMENT_BYTES) {
    return { ok: false, fileName, reason: `“${fileName}” is ${(size / 1024 / 1024).toFixed(1)} MB; attachments may be at most ${MAX_ATTACHMENT_LABEL}.` };
  }
  return null;
}

export function checkAttachment(name: string, bytes: Uint8Array): AttachmentVerdict {
  const sized = checkSize(name, bytes.length);
  if (sized) return sized;
  let fileName = sanitizeFileName(name);
  const family = sniffContent(bytes);
  if (!family) {
    return { ok: false, fileName, reason: `“${fileName}” is not a PDF, PNG, JPEG, FITS, CSV or plain-text file (judged by its content).` };
  }
  const claimed = familyOfName(fileName);
  if (claimed && claimed !== family) {
    return { ok: false, fileName, reason: `“${fileName}” is named like ${FAMILY_INFO[claimed].label} but its content is ${FAMILY_INFO[family].label}.` };
  }
  if (!claimed) fileName = `${fileName}${FAMILY_INFO[family].extensions[0]}`;
  const contentType = family === "text" && fileName.toLowerCase().endsWith(".csv") ? "text/csv" : FAMILY_INFO[family].contentType;
  return { ok: true, fileName, contentType };
}
