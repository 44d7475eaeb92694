/**
 * Reading an uploaded file back from the upload service (the real one or the local fake),
 * so the server judges the bytes that were actually stored, not what the browser claimed.
 */
import { MAX_ATTACHMENT_BYTES } from "./content";

export class StoredFileError extends Error {}

const TIMEOUT_MS = 15_000;

export async function readStoredFile(url: string, fetchImpl: typeof fetch = fetch): Promise<Uint8Array> {
  let response: Response;
  try {
    response = await fetchImpl(url, { signal: AbortSignal.timeout(TIMEOUT_MS), cache: "no-store" });
  } catch (error) {
    const why = error instanceof Error && error.name === "TimeoutError" ? "it did not answer in time" : "it could not be reached";
    throw new StoredFileError(`The upload service holds the file but ${why}, so it could not be checked. Try the upload again in a moment.`);
  }
  if (!response.ok || !response.body) {
    throw new StoredFileError(`The upload service answered ${response.status} when the file was read back for checking. Try the upload again.`);
  }
  const chunks: Uint8Array[] = [];
  let total = 0;
  const reader = response.body.getReader();
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.length;
    // One byte over the limit is enough to refuse; never hold more than that in memory.
    if (total > MAX_ATTACHMENT_BYTES + 1) {
      await reader.cancel();
      break;
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(Math.min(total, MAX_ATTACHMENT_BYTES + 1));
  let offset = 0;
  for (const chunk of chunks) {
    const part = chunk.subarray(0, bytes.length - offset);
    bytes.set(part, offset);
    offset += part.length;
  }
  return bytes;
}
