/**
 * What an attachment is, judged by its bytes rather than its name: PDF, PNG, JPEG, FITS
 * (its first header card starts "SIMPLE  ="), or text (valid UTF-8 with no NUL or other
 * control bytes besides tabs and line breaks; a .csv name makes it CSV). Pure, so the browser checks a file before sending it and the
 * server checks the stored copy again with the same rules.
 */
export const MAX_ATTACHMENT_BYTES = 20 * 1024 * 1024;
export const MAX_ATTACHMENT_LABEL = "20 MB";

export const CONTENT_FAMILIES = ["pdf", "png", "jpeg", "fits", "text"] as const;
export type ContentFamily = (typeof CONTENT_FAMILIES)[number];

export const FAMILY_INFO: Record<ContentFamily, { label: string; contentType: string; extensions: readonly string[] }> = {
  pdf: { label: "a PDF document", contentType: "application/pdf", extensions: [".pdf"] },
  png: { label: "a PNG image", contentType: "image/png", extensions: [".png"] },
  jpeg: { label: "a JPEG image", contentType: "image/jpeg", extensions: [".jpg", ".jpeg"] },
  fits: { label: "a FITS file", contentType: "application/fits", extensions: [".fits", ".fit", ".fts"] },
  text: { label: "plain text or CSV", contentType: "text/plain", extensions: [".txt", ".csv"] },
};

/** Accepted name endings, for the file picker and messages. */
export const ACCEPTED_EXTENSIONS = Object.values(FAMILY_INFO).flatMap((f) => f.extensions);

function startsWith(bytes: Uint8Array, signature: readonly number[]): boolean {
  return bytes.length >= signature.length && signature.every((b, i) => bytes[i] === b);
}

const PDF = [0x25, 0x50, 0x44, 0x46, 0x2d]; // "%PDF-"
const PNG = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG = [0xff, 0xd8, 0xff];
const FITS = Array.from("SIMPLE  =", (c) => c.charCodeAt(0));

// Tab, line feed, form feed and carriage return are the only control bytes text may hold.
const TEXT_CONTROLS = new Set([0x09, 0x0a, 0x0c, 0x0d]);

function isText(bytes: Uint8Array): boolean {
  for (const b of bytes) if ((b < 0x20 && !TEXT_CONTROLS.has(b)) || b === 0x7f) return false;
  try {
    new TextDecoder("utf-8", { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
}

/** The family the content belongs to, or null when it is none of the accepted ones. */
export function sniffContent(bytes: Uint8Array): ContentFamily | null {
  if (startsWith(bytes, PDF)) return "pdf";
  if (startsWith(bytes, PNG)) return "png";
  if (startsWith(bytes, JPEG)) return "jpeg";
  if (startsWith(bytes, FITS)) return "fits";
  if (bytes.length > 0 && isText(bytes)) return "text";
  return null;
}

export function familyOfName(name: string): ContentFamily | null {
  const dot = name.lastIndexOf(".");
  if (dot <= 0) return null;
  const ext = name.slice(dot).toLowerCase();
  return CONTENT_FAMILIES.find((f) => FAMILY_INFO[f].extensions.includes(ext)) ?? null;
}
