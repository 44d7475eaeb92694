/**
 * Upload failures as the PI should read them. The UploadThing client rejects with an
 * UploadThingError (our route's own refusals keep their message), a FetchError when the
 * upload service cannot be reached, or a plain network error. Pure: runs in the browser.
 */
const SERVICE_DOWN =
  "The upload service is not answering, so the file was not stored. Everything you typed is kept: try the upload again in a moment.";
const APP_DOWN = "Nightbreak could not be reached to prepare the upload. Check your connection; everything you typed is kept.";

/** Codes whose message our route wrote for the person (size, permission, state). */
const OWN_MESSAGES = new Set(["BAD_REQUEST", "FORBIDDEN", "TOO_LARGE", "TOO_SMALL", "TOO_MANY_FILES", "FILE_LIMIT_EXCEEDED"]);

function field(error: unknown, name: string): unknown {
  return typeof error === "object" && error !== null ? (error as Record<string, unknown>)[name] : undefined;
}

export function describeUploadError(error: unknown): string {
  // The React hook wraps anything unexpected (a network failure too) and keeps it as the cause.
  const cause = field(error, "cause");
  if (field(error, "code") === "INTERNAL_CLIENT_ERROR" && cause !== undefined && cause !== error && !/report event/i.test(String(field(error, "message")))) {
    return describeUploadError(cause);
  }
  const tag = field(error, "_tag");
  const code = field(error, "code");
  const message = field(error, "message");
  const text = typeof message === "string" ? message : "";
  if (tag === "FetchError" || (error instanceof TypeError && /fetch|network/i.test(text))) return SERVICE_DOWN;
  if (typeof code === "string") {
    if (code === "BAD_REQUEST" && text === "Invalid input") return "Save the draft before attaching files (type a target name first).";
    if (OWN_MESSAGES.has(code) && text !== "") return text;
    if (code === "INTERNAL_CLIENT_ERROR" && /report event/i.test(text)) return APP_DOWN;
    if (code === "UPLOAD_FAILED" || code === "URL_GENERATION_FAILED") return SERVICE_DOWN;
    if (code === "MISSING_ENV" || code === "INVALID_SERVER_CONFIG") return "Uploads are not configured on this server. Everything you typed is kept.";
  }
  if (/not configured/i.test(text)) return text;
  return `The upload failed${text ? ` (${text})` : ""}. Everything you typed is kept: try again.`;
}
