/** Size messages shared by the browser (before sending) and the server (after receiving). */
import { MAX_IMPORT_BYTES } from "./types";

export function formatBytes(bytes: number): string {
  return bytes >= 1_000_000 ? `${(bytes / 1_000_000).toFixed(1)} MB` : `${Math.ceil(bytes / 1000)} kB`;
}

export function tooLargeMessage(bytes: number): string {
  return `The file is ${formatBytes(bytes)}; the limit is ${formatBytes(MAX_IMPORT_BYTES)}. Split the schedule into several files.`;
}
