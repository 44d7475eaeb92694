/**
 * File names as shown and stored with an attachment. The name is data, never a path: only
 * the last segment survives, control and shell-awkward characters become "_", leading dots
 * go (no "..", no hidden files). The file itself is stored under the upload service's own
 * key, so a name cannot reach the file system whatever it says.
 */
const MAX_NAME = 120;

export function sanitizeFileName(raw: string): string {
  const lastSegment = String(raw).normalize("NFC").split(/[/\\]/).pop() ?? "";
  const cleaned = lastSegment
    .replace(/[\u0000-\u001f\u007f-\u009f]/g, "")
    .replace(/[<>:"|?*`$]/g, "_")
    .replace(/\s+/g, " ")
    .trim()
    .replace(/^[.\s]+/, "");
  if (cleaned === "" || /^[._\s-]*$/.test(cleaned)) return "file";
  if (cleaned.length <= MAX_NAME) return cleaned;
  const dot = cleaned.lastIndexOf(".");
  const ext = dot > 0 && cleaned.length - dot <= 8 ? cleaned.slice(dot) : "";
  return cleaned.slice(0, MAX_NAME - ext.length) + ext;
}
