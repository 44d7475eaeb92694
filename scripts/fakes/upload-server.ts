/**
 * Local fake of UploadThing's ingest and API hosts (one server plays both), written
 * against the wire protocol of `uploadthing@7.7.4` as read in its dist files.
 *
 * Ingest (UPLOADTHING_INGEST_URL):
 * - POST /route-metadata (x-uploadthing-api-key): the app registers the file keys of an
 *   upload with its route slug, metadata and callback URL. In dev mode (`isDev`) the
 *   answer is a held-open stream of JSON lines `{ payload, signature, hook }` that the
 *   app forwards to itself; otherwise `{ ok: true }` and the fake calls the app back.
 * - HEAD/PUT /<fileKey>?expires&x-ut-…&signature: the presigned URL, checked with
 *   HMAC-SHA256 (apiKey) over the URL before `&signature=`. The PUT carries a multipart
 *   field `file`. With `x-ut-slug` (a route upload) the PUT is held until the app has run
 *   `onUploadComplete` and posted `{ fileKey, callbackData }` to /callback-result, then
 *   answered `{ url, appUrl, ufsUrl, fileHash, serverData }`. A PUT may arrive before its
 *   registration. Without a slug (UTApi.uploadFiles) it is answered at once.
 * - OPTIONS: CORS preflight for browser uploads; `x-ut-range-start` is exposed.
 * API (UPLOADTHING_API_URL): POST /v6/deleteFiles, listFiles, getFileUrl,
 * requestFileAccess, renameFiles, updateACL, getUsageInfo.
 * Files: GET /f/<key> and /a/<appId>/<key> (private files need a signed URL).
 * Test/demo control (no auth, loopback only): GET /_files, DELETE /_files.
 *
 * Storage: `<dir>/objects/<uuid>` for bytes and `<dir>/records/<uuid>.json` for what we
 * know about them. Names are ours; the client's file name is data, never a path.
 *
 * Env (used when an option is not passed): FAKE_UPLOAD_PORT (4020), FAKE_UPLOAD_DIR
 * (.data/fake-uploads), UPLOADTHING_TOKEN (else the local token of lib/uploads/token.ts),
 * FAKE_UPLOAD_PUBLIC_URL (base of file URLs; default the fake's own URL),
 * FAKE_UPLOAD_MAX_BYTES (64 MiB).
 */
import { createHash, createHmac, randomUUID, timingSafeEqual } from "node:crypto";
import { mkdir, readdir, readFile, rm, stat } from "node:fs/promises";
import { createReadStream } from "node:fs";
import type { IncomingMessage, ServerResponse } from "node:http";
import { join, resolve } from "node:path";
import { LOCAL_UPLOAD_API_KEY, LOCAL_UPLOAD_APP_ID, parseUploadThingToken } from "../../lib/uploads/token";
import {
  BodyTooLargeError,
  envNumber,
  isMainModule,
  isRecord,
  listenOnLoopback,
  LOOPBACK,
  parseJson,
  readBody,
  sendJson,
  writeFileAtomic,
} from "./http-helpers";

export type UploadFakeOptions = {
  port?: number;
  dir?: string;
  /** HMAC secret shared with the SDK (the token's apiKey). */
  apiKey?: string;
  appId?: string;
  /** Base of the file URLs handed out; defaults to the fake's own http://127.0.0.1:<port>. */
  publicUrl?: string;
  maxFileBytes?: number;
  /** How long a route upload's PUT waits for the app to register its metadata. */
  registrationWaitMs?: number;
  /** How long a route upload's PUT waits for the app's `onUploadComplete` result. */
  callbackWaitMs?: number;
  /** How long a dev-mode registration stream stays open waiting for its uploads. */
  registrationTtlMs?: number;
};

export type UploadFake = {
  url: string;
  port: number;
  dir: string;
  close: () => Promise<void>;
};

type Acl = "public-read" | "private";
type ContentDisposition = "inline" | "attachment";

export type StoredUpload = {
  key: string;
  storageName: string;
  name: string;
  size: number;
  type: string;
  customId: string | null;
  fileHash: string;
  acl: Acl;
  contentDisposition: ContentDisposition;
  slug: string | null;
  uploadedAt: number;
  /** Set once the app has answered the callback (route uploads only). */
  callbackDone: boolean;
  serverData: unknown;
};

type Registration = {
  pending: Set<string>;
  metadata: unknown;
  isDev: boolean;
  callbackUrl: string;
  callbackSlug: string;
  awaitServerData: boolean;
  stream: ServerResponse | null;
  ttl: NodeJS.Timeout | undefined;
};

type UploadResult = { url: string; appUrl: string; ufsUrl: string; fileHash: string; serverData: unknown };
type Outcome<T> = { ok: true; value: T } | { ok: false; status: number; error: string };

const KEY_PATTERN = /^[A-Za-z0-9_-]{1,128}$/;
const STORAGE_NAME = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;
const SIGNATURE_PREFIX = "hmac-sha256=";
const MULTIPART_SLACK = 64 * 1024;
const JSON_LIMIT = 1024 * 1024;

function hmacHex(secret: string, payload: string): string {
  return createHmac("sha256", secret).update(payload).digest("hex");
}

function safeEqual(a: string, b: string): boolean {
  const left = Buffer.from(a);
  const right = Buffer.from(b);
  return left.length === right.length && timingSafeEqual(left, right);
}

/** The SDK encodes `x-ut-*` values with encodeURIComponent before URLSearchParams encodes them again. */
function utParam(params: URLSearchParams, name: string): string | null {
  const raw = params.get(name);
  if (raw === null) return null;
  try {
    return decodeURIComponent(raw);
  } catch {
    return raw;
  }
}

function safeContentType(type: string): string {
  return /^[\w.+-]+\/[\w.+-]+$/.test(type) ? type : "application/octet-stream";
}

function contentDispositionHeader(kind: ContentDisposition, name: string): string {
  // Quotes, control characters and path separators never reach the header as such.
  const ascii = name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\/]/g, "_");
  return `${kind}; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

function corsHeaders(req: IncomingMessage): Record<string, string> {
  const origin = req.headers.origin;
  return {
    "access-control-allow-origin": typeof origin === "string" ? origin : "*",
    "access-control-expose-headers": "x-ut-range-start, x-uploadthing-version",
    vary: "origin",
  };
}

function withTimeout<T>(promise: Promise<T>, ms: number, message: string, timers: Set<NodeJS.Timeout>): Promise<T> {
  return new Promise<T>((resolvePromise, rejectPromise) => {
    const timer = setTimeout(() => {
      timers.delete(timer);
      rejectPromise(new Error(message));
    }, ms);
    timers.add(timer);
    promise.then(
      (value) => {
        clearTimeout(timer);
        timers.delete(timer);
        resolvePromise(value);
      },
      (error: unknown) => {
        clearTimeout(timer);
        timers.delete(timer);
        rejectPromise(error instanceof Error ? error : new Error(String(error)));
      },
    );
  });
}

function resolveCredentials(options: UploadFakeOptions): { apiKey: string; appId: string } {
  if (options.apiKey !== undefined && options.appId !== undefined) return { apiKey: options.apiKey, appId: options.appId };
  const token = process.env.UPLOADTHING_TOKEN;
  const fromToken = token !== undefined && token !== "" ? parseUploadThingToken(token) : null;
  return {
    apiKey: options.apiKey ?? fromToken?.apiKey ?? LOCAL_UPLOAD_API_KEY,
    appId: options.appId ?? fromToken?.appId ?? LOCAL_UPLOAD_APP_ID,
  };
}

function stringList(value: unknown): string[] | null {
  if (value === undefined) return null;
  return Array.isArray(value) && value.every((v): v is string => typeof v === "string") ? value : null;
}

export async function startUploadFake(options: UploadFakeOptions = {}): Promise<UploadFake> {
  const env = process.env;
  const port = options.port ?? envNumber(env, "FAKE_UPLOAD_PORT") ?? 4020;
  const dir = resolve(options.dir ?? env.FAKE_UPLOAD_DIR ?? ".data/fake-uploads");
  const maxFileBytes = options.maxFileBytes ?? envNumber(env, "FAKE_UPLOAD_MAX_BYTES") ?? 64 * 1024 * 1024;
  const registrationWaitMs = options.registrationWaitMs ?? 30_000;
  const callbackWaitMs = options.callbackWaitMs ?? 30_000;
  const registrationTtlMs = options.registrationTtlMs ?? 10 * 60_000;
  const { apiKey, appId } = resolveCredentials(options);
  const objectsDir = join(dir, "objects");
  const recordsDir = join(dir, "records");
  await mkdir(objectsDir, { recursive: true });
  await mkdir(recordsDir, { recursive: true });

  const files = new Map<string, StoredUpload>();
  const registrations = new Map<string, Registration>();
  const registrationWaiters = new Map<string, ((r: Registration) => void)[]>();
  const resultWaiters = new Map<string, { resolve: (data: unknown) => void; reject: (error: Error) => void }>();
  const timers = new Set<NodeJS.Timeout>();
  let publicUrl = options.publicUrl ?? env.FAKE_UPLOAD_PUBLIC_URL ?? "";
  let ownUrl = "";

  for (const name of await readdir(recordsDir)) {
    if (!name.endsWith(".json")) continue;
    const parsed = parseJson(await readFile(join(recordsDir, name)));
    // Only records whose storage name is one of ours, so an edited record cannot point outside the folder.
    if (parsed.ok && isRecord(parsed.value) && typeof parsed.value.key === "string" && `${String(parsed.value.storageName)}.json` === name && STORAGE_NAME.test(String(parsed.value.storageName))) {
      files.set(parsed.value.key, parsed.value as StoredUpload);
    }
  }

  function fileUrls(key: string): { url: string; appUrl: string; ufsUrl: string } {
    const ufsUrl = `${publicUrl}/f/${key}`;
    return { url: ufsUrl, appUrl: `${publicUrl}/a/${appId}/${key}`, ufsUrl };
  }

  function signUrl(url: string, expiresInSeconds: number): string {
    const parsed = new URL(url);
    parsed.searchParams.append("expires", String(Date.now() + expiresInSeconds * 1000));
    const signature = `${SIGNATURE_PREFIX}${hmacHex(apiKey, parsed.toString())}`;
    parsed.searchParams.append("signature", signature);
    return parsed.href;
  }

  /** Checks a URL signed the SDK's way: HMAC over everything before `&signature=`, plus `expires`. */
  function verifySignedRequest(req: IncomingMessage): Outcome<URLSearchParams> {
    const raw = req.url ?? "/";
    const cut = raw.lastIndexOf("&signature=");
    const params = new URL(raw, "http://placeholder").searchParams;
    const given = params.get("signature");
    if (cut < 0 || given === null) return { ok: false, status: 403, error: "missing signature" };
    const host = req.headers.host ?? new URL(ownUrl).host;
    const signedPart = raw.slice(0, cut);
    // The SDK signs the full URL it was configured with; we only see the Host header.
    const matches = ["http", "https"].some((proto) => safeEqual(`${SIGNATURE_PREFIX}${hmacHex(apiKey, `${proto}://${host}${signedPart}`)}`, given));
    if (!matches) return { ok: false, status: 403, error: "invalid signature" };
    const expires = Number(params.get("expires"));
    if (!Number.isFinite(expires) || expires < Date.now()) return { ok: false, status: 403, error: "presigned URL expired" };
    const identifier = utParam(params, "x-ut-identifier");
    if (identifier !== null && identifier !== appId) return { ok: false, status: 403, error: "presigned URL is for another app" };
    return { ok: true, value: params };
  }

  function checkApiKey(req: IncomingMessage): boolean {
    const given = req.headers["x-uploadthing-api-key"];
    return typeof given === "string" && safeEqual(given, apiKey);
  }

  async function saveRecord(record: StoredUpload): Promise<void> {
    await writeFileAtomic(join(recordsDir, `${record.storageName}.json`), JSON.stringify(record, null, 2));
  }

  async function removeFile(record: StoredUpload): Promise<void> {
    files.delete(record.key);
    await rm(join(objectsDir, record.storageName), { force: true });
    await rm(join(recordsDir, `${record.storageName}.json`), { force: true });
  }

  function findByKeyOrCustomId(body: Record<string, unknown>): StoredUpload | undefined {
    if (typeof body.fileKey === "string") return files.get(body.fileKey);
    if (typeof body.customId === "string") return [...files.values()].find((f) => f.customId === body.customId);
    return undefined;
  }

  function waitForRegistration(key: string): Promise<Registration> {
    const existing = registrations.get(key);
    if (existing !== undefined) return Promise.resolve(existing);
    return withTimeout(
      new Promise<Registration>((resolveWait) => {
        const list = registrationWaiters.get(key) ?? [];
        list.push(resolveWait);
        registrationWaiters.set(key, list);
      }),
      registrationWaitMs,
      "the app never registered this upload (POST /route-metadata)",
      timers,
    ).finally(() => registrationWaiters.delete(key));
  }

  function finishKey(registration: Registration, key: string): void {
    registration.pending.delete(key);
    if (registrations.get(key) === registration) registrations.delete(key);
    if (registration.pending.size === 0) {
      if (registration.ttl !== undefined) {
        clearTimeout(registration.ttl);
        timers.delete(registration.ttl);
      }
      registration.stream?.end();
      registration.stream = null;
    }
  }

  /** Tells the app about a finished upload: a line on the dev stream, or a signed POST to its callback URL. */
  function sendCallback(registration: Registration, record: StoredUpload, onFailure: (error: Error) => void): void {
    const payload = JSON.stringify({
      status: "uploaded",
      file: {
        name: record.name,
        size: record.size,
        type: record.type,
        customId: record.customId,
        key: record.key,
        ...fileUrls(record.key),
        fileHash: record.fileHash,
      },
      origin: ownUrl,
      metadata: registration.metadata,
    });
    const signature = `${SIGNATURE_PREFIX}${hmacHex(apiKey, payload)}`;
    if (registration.isDev) {
      if (registration.stream === null || registration.stream.writableEnded) {
        onFailure(new Error("the app's registration stream is closed"));
        return;
      }
      registration.stream.write(`${JSON.stringify({ payload, signature, hook: "callback" })}\n`);
      return;
    }
    const target = new URL(registration.callbackUrl);
    target.searchParams.set("slug", registration.callbackSlug);
    fetch(target, {
      method: "POST",
      headers: { "content-type": "application/json", "uploadthing-hook": "callback", "x-uploadthing-signature": signature },
      body: payload,
      signal: AbortSignal.timeout(callbackWaitMs),
    })
      .then(async (response) => {
        await response.arrayBuffer();
        if (!response.ok) onFailure(new Error(`the app answered the upload callback with ${response.status}`));
      })
      .catch((error: unknown) => onFailure(new Error(`the upload callback to the app failed: ${error instanceof Error ? error.message : String(error)}`)));
  }

  async function handleRouteMetadata(req: IncomingMessage, res: ServerResponse): Promise<void> {
    if (!checkApiKey(req)) {
      req.resume();
      sendJson(res, 401, { error: "invalid or missing x-uploadthing-api-key" });
      return;
    }
    const parsed = parseJson(await readBody(req, JSON_LIMIT));
    if (!parsed.ok || !isRecord(parsed.value)) {
      sendJson(res, 400, { error: "body must be JSON" });
      return;
    }
    const body = parsed.value;
    const fileKeys = stringList(body.fileKeys);
    if (fileKeys === null || fileKeys.length === 0 || !fileKeys.every((k) => KEY_PATTERN.test(k))) {
      sendJson(res, 400, { error: "fileKeys must be a non-empty list of file keys" });
      return;
    }
    if (typeof body.callbackUrl !== "string" || typeof body.callbackSlug !== "string") {
      sendJson(res, 400, { error: "callbackUrl and callbackSlug are required" });
      return;
    }
    let callbackProtocol = "";
    try {
      callbackProtocol = new URL(body.callbackUrl).protocol;
    } catch {
      callbackProtocol = "";
    }
    if (callbackProtocol !== "http:" && callbackProtocol !== "https:") {
      sendJson(res, 400, { error: "callbackUrl must be an http(s) URL" });
      return;
    }
    const registration: Registration = {
      pending: new Set(fileKeys),
      metadata: body.metadata ?? {},
      isDev: body.isDev === true,
      callbackUrl: body.callbackUrl,
      callbackSlug: body.callbackSlug,
      awaitServerData: body.awaitServerData !== false,
      stream: null,
      ttl: undefined,
    };
    // Uploads that never arrive must not pin the registration (and a dev stream) forever.
    const ttl = setTimeout(() => {
      timers.delete(ttl);
      for (const key of registration.pending) if (registrations.get(key) === registration) registrations.delete(key);
      registration.stream?.end();
      registration.stream = null;
    }, registrationTtlMs);
    timers.add(ttl);
    registration.ttl = ttl;
    if (registration.isDev) {
      res.writeHead(200, { "content-type": "application/x-ndjson", "cache-control": "no-store" });
      res.flushHeaders();
      registration.stream = res;
      res.on("close", () => {
        registration.stream = null;
      });
    }
    for (const key of fileKeys) {
      registrations.set(key, registration);
      for (const wake of registrationWaiters.get(key) ?? []) wake(registration);
    }
    if (!registration.isDev) sendJson(res, 200, { ok: true });
  }

  async function handleCallbackResult(req: IncomingMessage, res: ServerResponse): Promise<void> {
    if (!checkApiKey(req)) {
      req.resume();
      sendJson(res, 401, { error: "invalid or missing x-uploadthing-api-key" });
      return;
    }
    const parsed = parseJson(await readBody(req, JSON_LIMIT));
    if (!parsed.ok || !isRecord(parsed.value) || typeof parsed.value.fileKey !== "string") {
      sendJson(res, 400, { error: "body must be { fileKey, callbackData } or { fileKey, error }" });
      return;
    }
    const { fileKey } = parsed.value;
    const waiter = resultWaiters.get(fileKey);
    if (typeof parsed.value.error === "string") {
      waiter?.reject(new Error(parsed.value.error));
    } else {
      const serverData = parsed.value.callbackData ?? null;
      const record = files.get(fileKey);
      if (record !== undefined) {
        record.serverData = serverData;
        await saveRecord(record);
      }
      waiter?.resolve(serverData);
    }
    sendJson(res, 200, { ok: true });
  }

  async function handlePut(req: IncomingMessage, res: ServerResponse, key: string, params: URLSearchParams): Promise<void> {
    const cors = corsHeaders(req);
    const declaredSize = Number(utParam(params, "x-ut-file-size"));
    if (!Number.isInteger(declaredSize) || declaredSize < 0) {
      req.resume();
      sendJson(res, 400, { error: "presigned URL has no valid x-ut-file-size" }, cors);
      return;
    }
    if (declaredSize > maxFileBytes) {
      req.resume();
      sendJson(res, 413, { error: `file larger than this server accepts (${maxFileBytes} bytes)` }, cors);
      return;
    }
    const range = /^bytes=(\d+)-$/.exec(String(req.headers.range ?? "bytes=0-"));
    if (range === null || range[1] !== "0") {
      // HEAD always answers x-ut-range-start: 0, so a client never resumes mid-file here.
      req.resume();
      sendJson(res, 416, { error: "resuming a partial upload is not supported by the local fake" }, cors);
      return;
    }
    let raw: Buffer;
    try {
      raw = await readBody(req, declaredSize + MULTIPART_SLACK);
    } catch (error) {
      if (error instanceof BodyTooLargeError) {
        sendJson(res, 413, { error: "upload larger than the size in the presigned URL" }, cors);
        return;
      }
      throw error;
    }
    const contentType = req.headers["content-type"] ?? "";
    let part: FormDataEntryValue | null = null;
    try {
      part = (await new Response(new Uint8Array(raw), { headers: { "content-type": contentType } }).formData()).get("file");
    } catch {
      part = null;
    }
    if (part === null || typeof part === "string") {
      sendJson(res, 400, { error: "expected a multipart/form-data body with a file field named 'file'" }, cors);
      return;
    }
    const bytes = Buffer.from(await part.arrayBuffer());
    if (bytes.length !== declaredSize) {
      sendJson(res, 400, { error: `received ${bytes.length} bytes but the presigned URL says ${declaredSize}` }, cors);
      return;
    }
    const fileHash = createHash("md5").update(bytes).digest("hex");
    const slug = utParam(params, "x-ut-slug");
    const existing = files.get(key);
    if (existing !== undefined && existing.callbackDone && existing.fileHash === fileHash) {
      // A retried PUT of a finished upload: answer as before instead of calling the app twice.
      sendJson(res, 200, { ...fileUrls(key), fileHash, serverData: existing.serverData } satisfies UploadResult, cors);
      return;
    }
    const acl: Acl = utParam(params, "x-ut-acl") === "private" ? "private" : "public-read";
    const record: StoredUpload = {
      key,
      storageName: randomUUID(),
      name: utParam(params, "x-ut-file-name") ?? "unnamed",
      size: bytes.length,
      type: safeContentType(utParam(params, "x-ut-file-type") ?? part.type),
      customId: utParam(params, "x-ut-custom-id"),
      fileHash,
      acl,
      contentDisposition: utParam(params, "x-ut-content-disposition") === "attachment" ? "attachment" : "inline",
      slug,
      uploadedAt: Date.now(),
      callbackDone: slug === null,
      serverData: null,
    };
    await writeFileAtomic(join(objectsDir, record.storageName), bytes);
    await saveRecord(record);
    if (existing !== undefined) await removeFile(existing);
    files.set(key, record);

    if (slug === null) {
      sendJson(res, 200, { ...fileUrls(key), fileHash, serverData: null } satisfies UploadResult, cors);
      return;
    }
    let registration: Registration;
    try {
      registration = await waitForRegistration(key);
    } catch (error) {
      sendJson(res, 504, { error: error instanceof Error ? error.message : "no registration" }, cors);
      return;
    }
    // The waiter exists before the callback goes out: the app may answer very quickly.
    const result = new Promise<unknown>((resolveResult, rejectResult) => {
      resultWaiters.set(key, { resolve: resolveResult, reject: rejectResult });
    });
    sendCallback(registration, record, (error) => resultWaiters.get(key)?.reject(error));
    if (!registration.awaitServerData) {
      resultWaiters.delete(key);
      result.catch(() => {});
      record.callbackDone = true;
      await saveRecord(record);
      finishKey(registration, key);
      sendJson(res, 200, { ...fileUrls(key), fileHash, serverData: null } satisfies UploadResult, cors);
      return;
    }
    try {
      const serverData = await withTimeout(result, callbackWaitMs, "the app did not report onUploadComplete's result in time", timers);
      record.callbackDone = true;
      record.serverData = serverData;
      await saveRecord(record);
      sendJson(res, 200, { ...fileUrls(key), fileHash, serverData } satisfies UploadResult, cors);
    } catch (error) {
      sendJson(res, 502, { error: error instanceof Error ? error.message : "upload callback failed" }, cors);
    } finally {
      resultWaiters.delete(key);
      finishKey(registration, key);
    }
  }

  async function handleIngestKey(req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
    const cors = corsHeaders(req);
    if (req.method === "OPTIONS") {
      const requested = req.headers["access-control-request-headers"];
      // Chromium's private-network preflight, should a page on another address upload here.
      const privateNetwork = req.headers["access-control-request-private-network"] === "true" ? { "access-control-allow-private-network": "true" } : {};
      res.writeHead(204, {
        ...cors,
        ...privateNetwork,
        "access-control-allow-methods": "GET, HEAD, PUT, OPTIONS",
        "access-control-allow-headers": typeof requested === "string" ? requested : "content-type, range, x-uploadthing-version, b3, traceparent",
        "access-control-max-age": "600",
      });
      res.end();
      return;
    }
    if (req.method !== "HEAD" && req.method !== "PUT") {
      req.resume();
      sendJson(res, 405, { error: "method not allowed" }, cors);
      return;
    }
    const verified = verifySignedRequest(req);
    if (!verified.ok) {
      req.resume();
      sendJson(res, verified.status, { error: verified.error }, cors);
      return;
    }
    if (req.method === "HEAD") {
      res.writeHead(200, { ...cors, "x-ut-range-start": "0", "cache-control": "no-store" });
      res.end();
      return;
    }
    await handlePut(req, res, key, verified.value);
  }

  async function serveFile(req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
    const record = files.get(key);
    if (record === undefined) {
      sendJson(res, 404, { error: "file not found" }, { "access-control-allow-origin": "*" });
      return;
    }
    if (record.acl === "private" && !verifySignedRequest(req).ok) {
      sendJson(res, 403, { error: "this file is private: use a signed URL" }, { "access-control-allow-origin": "*" });
      return;
    }
    const path = join(objectsDir, record.storageName);
    const info = await stat(path).catch(() => null);
    if (info === null) {
      sendJson(res, 404, { error: "file content missing" });
      return;
    }
    res.writeHead(200, {
      "content-type": safeContentType(record.type),
      "content-length": String(info.size),
      "content-disposition": contentDispositionHeader(record.contentDisposition, record.name),
      "x-content-type-options": "nosniff",
      // Uploaded content is untrusted: never let it run as a page on this origin. PDFs are
      // exempt because browsers refuse to show a PDF in a sandboxed document.
      ...(record.type === "application/pdf" ? {} : { "content-security-policy": "sandbox" }),
      "access-control-allow-origin": "*",
      etag: `"${record.fileHash}"`,
      "cache-control": "no-cache",
    });
    if (req.method === "HEAD") {
      res.end();
      return;
    }
    createReadStream(path).pipe(res);
  }

  async function handleApi(req: IncomingMessage, res: ServerResponse, action: string): Promise<void> {
    if (!checkApiKey(req)) {
      req.resume();
      sendJson(res, 401, { error: "invalid or missing x-uploadthing-api-key" });
      return;
    }
    const parsed = parseJson(await readBody(req, JSON_LIMIT));
    const body = parsed.ok && isRecord(parsed.value) ? parsed.value : null;
    if (body === null) {
      sendJson(res, 400, { error: "body must be a JSON object" });
      return;
    }
    const byKeys = (): StoredUpload[] => {
      const keys = stringList(body.fileKeys);
      const customIds = stringList(body.customIds);
      const all = [...files.values()];
      if (keys !== null) return keys.map((k) => files.get(k)).filter((f): f is StoredUpload => f !== undefined);
      if (customIds !== null) return all.filter((f) => f.customId !== null && customIds.includes(f.customId));
      return [];
    };
    switch (action) {
      case "deleteFiles": {
        const targets = byKeys();
        for (const record of targets) await removeFile(record);
        sendJson(res, 200, { success: true, deletedCount: targets.length });
        return;
      }
      case "listFiles": {
        const limit = typeof body.limit === "number" ? Math.max(0, Math.floor(body.limit)) : 500;
        const offset = typeof body.offset === "number" ? Math.max(0, Math.floor(body.offset)) : 0;
        const all = [...files.values()].sort((a, b) => a.uploadedAt - b.uploadedAt);
        const page = all.slice(offset, offset + limit);
        sendJson(res, 200, {
          hasMore: offset + limit < all.length,
          files: page.map((f) => ({
            id: f.storageName,
            customId: f.customId,
            key: f.key,
            name: f.name,
            size: f.size,
            status: f.callbackDone ? "Uploaded" : "Uploading",
            uploadedAt: f.uploadedAt,
          })),
        });
        return;
      }
      case "getFileUrl": {
        sendJson(res, 200, { data: byKeys().map((f) => ({ key: f.key, url: fileUrls(f.key).ufsUrl })) });
        return;
      }
      case "requestFileAccess": {
        const record = findByKeyOrCustomId(body);
        if (record === undefined) {
          sendJson(res, 404, { error: "file not found" });
          return;
        }
        const expiresIn = typeof body.expiresIn === "number" && body.expiresIn > 0 ? body.expiresIn : 3600;
        const signed = signUrl(fileUrls(record.key).ufsUrl, expiresIn);
        sendJson(res, 200, { url: signed, ufsUrl: signed });
        return;
      }
      case "renameFiles":
      case "updateACL": {
        const updates = Array.isArray(body.updates) ? body.updates.filter(isRecord) : [];
        for (const update of updates) {
          const record = findByKeyOrCustomId(update);
          if (record === undefined) continue;
          if (action === "renameFiles" && typeof update.newName === "string") record.name = update.newName;
          if (action === "updateACL" && (update.acl === "private" || update.acl === "public-read")) record.acl = update.acl;
          await saveRecord(record);
        }
        sendJson(res, 200, { success: true });
        return;
      }
      case "getUsageInfo": {
        const totalBytes = [...files.values()].reduce((sum, f) => sum + f.size, 0);
        sendJson(res, 200, { totalBytes, appTotalBytes: totalBytes, filesUploaded: files.size, limitBytes: 2 * 1024 ** 3 });
        return;
      }
      default:
        sendJson(res, 404, { error: `the local fake does not implement /v6/${action}` });
    }
  }

  async function handleControlFiles(req: IncomingMessage, res: ServerResponse): Promise<void> {
    if (req.method === "GET") {
      const data = [...files.values()].sort((a, b) => a.uploadedAt - b.uploadedAt).map((f) => ({ ...f, ...fileUrls(f.key) }));
      sendJson(res, 200, { count: data.length, data });
      return;
    }
    if (req.method === "DELETE") {
      const all = [...files.values()];
      for (const record of all) await removeFile(record);
      sendJson(res, 200, { deleted: all.length });
      return;
    }
    sendJson(res, 405, { error: "use GET or DELETE" });
  }

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", `http://${LOOPBACK}`);
    const segments = url.pathname.split("/").filter((s) => s !== "");
    const [first, second, third] = segments;
    if (req.method === "POST" && url.pathname === "/route-metadata") return handleRouteMetadata(req, res);
    if (req.method === "POST" && url.pathname === "/callback-result") return handleCallbackResult(req, res);
    if (req.method === "POST" && first === "v6" && second !== undefined && segments.length === 2) return handleApi(req, res, second);
    if (url.pathname === "/_files") return handleControlFiles(req, res);
    if ((req.method === "GET" || req.method === "HEAD") && first === "f" && second !== undefined && segments.length === 2) {
      return serveFile(req, res, second);
    }
    if ((req.method === "GET" || req.method === "HEAD") && first === "a" && second === appId && third !== undefined && segments.length === 3) {
      return serveFile(req, res, third);
    }
    if (first !== undefined && segments.length === 1 && KEY_PATTERN.test(first)) return handleIngestKey(req, res, first);
    req.resume();
    sendJson(res, 404, { error: "not found" });
  }

  const running = await listenOnLoopback(handle, port, () => {
    for (const timer of timers) clearTimeout(timer);
    timers.clear();
    for (const waiter of resultWaiters.values()) waiter.reject(new Error("the fake upload server is shutting down"));
    for (const registration of new Set(registrations.values())) registration.stream?.end();
  });
  ownUrl = `http://${LOOPBACK}:${running.port}`;
  if (publicUrl === "") publicUrl = ownUrl;
  publicUrl = publicUrl.replace(/\/$/, "");
  return { url: ownUrl, port: running.port, dir, close: running.close };
}

if (isMainModule(import.meta.url)) {
  const fake = await startUploadFake();
  console.log(`upload fake listening on ${fake.url} (files in ${fake.dir})`);
  const stop = (): void => {
    void fake.close().then(() => process.exit(0));
  };
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
}
