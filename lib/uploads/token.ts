/**
 * UPLOADTHING_TOKEN values for local use. A token is base64 of the JSON
 * `{ apiKey, appId, regions }`; the apiKey doubles as the HMAC secret that the
 * SDK and the upload service (or our local fake) share, so both sides must be
 * built from the same values.
 */

export type UploadThingTokenParts = {
  apiKey: string;
  appId: string;
  regions: string[];
  /** Only used by the SDK to build the default ingest URL; the fake is reached through UPLOADTHING_INGEST_URL instead. */
  ingestHost?: string;
};

// Invented values for development and tests only; never valid against the real service.
export const LOCAL_UPLOAD_API_KEY = "sk_local_nightbreak_fake_uploads_0001";
export const LOCAL_UPLOAD_APP_ID = "nightbreaklocal";
export const LOCAL_UPLOAD_REGION = "local-1";

export function buildUploadThingToken(parts: Partial<UploadThingTokenParts> = {}): string {
  const token: UploadThingTokenParts = {
    apiKey: parts.apiKey ?? LOCAL_UPLOAD_API_KEY,
    appId: parts.appId ?? LOCAL_UPLOAD_APP_ID,
    regions: parts.regions ?? [LOCAL_UPLOAD_REGION],
    ...(parts.ingestHost === undefined ? {} : { ingestHost: parts.ingestHost }),
  };
  // The SDK rejects keys without this prefix, so fail here with a clearer message.
  if (!token.apiKey.startsWith("sk_")) throw new Error("UploadThing apiKey must start with 'sk_'");
  if (token.appId.length === 0) throw new Error("UploadThing appId must not be empty");
  if (token.regions.length === 0) throw new Error("UploadThing token needs at least one region");
  return Buffer.from(JSON.stringify(token), "utf8").toString("base64");
}

export function parseUploadThingToken(token: string): UploadThingTokenParts {
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(token, "base64").toString("utf8"));
  } catch {
    throw new Error("UPLOADTHING_TOKEN is not base64-encoded JSON");
  }
  if (typeof parsed !== "object" || parsed === null) throw new Error("UPLOADTHING_TOKEN is not a JSON object");
  const record = parsed as Record<string, unknown>;
  const { apiKey, appId, regions, ingestHost } = record;
  if (typeof apiKey !== "string" || !apiKey.startsWith("sk_")) throw new Error("UPLOADTHING_TOKEN has no valid apiKey");
  if (typeof appId !== "string" || appId.length === 0) throw new Error("UPLOADTHING_TOKEN has no appId");
  if (!Array.isArray(regions) || regions.length === 0 || !regions.every((r): r is string => typeof r === "string")) {
    throw new Error("UPLOADTHING_TOKEN has no regions");
  }
  return {
    apiKey,
    appId,
    regions,
    ...(typeof ingestHost === "string" ? { ingestHost } : {}),
  };
}
