import { UserFacingError } from "@/lib/actions/result";
import { MAX_IMPORT_BYTES } from "./types";
import { tooLargeMessage } from "./upload-limits";

/** The file field of an import form (a chosen file, or pasted text sent as one), size-checked. */
export async function readUpload(form: FormData): Promise<{ fileName: string; text: string }> {
  const file = form.get("file");
  if (!(file instanceof Blob) || file.size === 0) throw new UserFacingError("Choose a schedule file or paste its contents first.");
  if (file.size > MAX_IMPORT_BYTES) throw new UserFacingError(tooLargeMessage(file.size));
  const fileName = file instanceof File && file.name ? file.name.slice(0, 255) : "pasted text";
  return { fileName, text: await file.text() };
}
