/**
 * Local fake of Resend's HTTP API, enough for the real `resend` SDK
 * (RESEND_BASE_URL=http://127.0.0.1:<port>, any non-empty RESEND_API_KEY).
 *
 * - POST /emails, POST /emails/batch, GET /emails/:id — Resend's paths, shapes and
 *   error bodies `{ statusCode, name, message }`.
 * - Every accepted message is one JSON file `<dir>/<id>.json` (snake_case, as Resend
 *   returns it). Idempotency records live in `<dir>/.idempotency/` so a restarted fake
 *   still answers a retried key with the same id.
 * - Fault injection: a share of requests (failRate) fails with 500 or 429. In
 *   "before-store" mode nothing is stored; in "after-store" mode the message is stored
 *   and the answer is still an error — the lost-response case that idempotency keys exist for.
 * - Control (no auth, loopback only): GET/POST /_control, GET /_messages,
 *   GET /_messages/:id, DELETE /_messages.
 *
 * Env (used when an option is not passed): FAKE_EMAIL_PORT (4010), FAKE_EMAIL_DIR
 * (.data/fake-email), FAKE_EMAIL_FAIL_RATE (0), FAKE_EMAIL_FAIL_STATUS (500),
 * FAKE_EMAIL_FAIL_MODE (before-store).
 */
import { createHash, randomUUID } from "node:crypto";
import { mkdir, readdir, readFile, rm } from "node:fs/promises";
import type { IncomingMessage, ServerResponse } from "node:http";
import { join, resolve } from "node:path";
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

export type EmailFailStatus = 500 | 429;
export type EmailFailMode = "before-store" | "after-store";
export type EmailFaults = { failRate: number; failStatus: EmailFailStatus; failMode: EmailFailMode };
export type EmailFakeStats = { requests: number; injectedFailures: number; stored: number; idempotentReplays: number };

export type EmailFakeOptions = {
  port?: number;
  dir?: string;
  faults?: Partial<EmailFaults>;
};

export type EmailFake = {
  url: string;
  port: number;
  dir: string;
  close: () => Promise<void>;
};

export type StoredEmail = {
  object: "email";
  id: string;
  created_at: string;
  from: string;
  to: string[];
  cc: string[] | null;
  bcc: string[] | null;
  reply_to: string[] | null;
  subject: string;
  html: string | null;
  text: string | null;
  headers: Record<string, string> | null;
  tags: { name: string; value: string }[] | null;
  attachments: unknown[] | null;
  scheduled_at: string | null;
  idempotency_key: string | null;
  batch_id: string | null;
};

type ResendError = { statusCode: number; name: string; message: string };
type IdempotencyRecord = { key: string; fingerprint: string; status: number; body: unknown };
type Validated = { ok: true; email: Omit<StoredEmail, "object" | "id" | "created_at" | "idempotency_key" | "batch_id"> } | { ok: false; message: string; name: string };

const MAX_BODY_BYTES = 25 * 1024 * 1024;
const MAX_RECIPIENTS = 50;
const MAX_BATCH = 100;
const IDEMPOTENCY_DIR = ".idempotency";

const DEFAULT_FAULTS: EmailFaults = { failRate: 0, failStatus: 500, failMode: "before-store" };

export function emailFaultsFromEnv(env: Record<string, string | undefined> = process.env): Partial<EmailFaults> {
  const faults: Partial<EmailFaults> = {};
  const rate = envNumber(env, "FAKE_EMAIL_FAIL_RATE");
  if (rate !== undefined) faults.failRate = checkRate(rate);
  const status = envNumber(env, "FAKE_EMAIL_FAIL_STATUS");
  if (status !== undefined) faults.failStatus = checkStatus(status);
  const mode = env.FAKE_EMAIL_FAIL_MODE;
  if (mode !== undefined && mode !== "") faults.failMode = checkMode(mode);
  return faults;
}

function checkRate(value: unknown): number {
  if (typeof value !== "number" || !(value >= 0 && value <= 1)) throw new Error("failRate must be a number from 0 to 1");
  return value;
}
function checkStatus(value: unknown): EmailFailStatus {
  if (value !== 500 && value !== 429) throw new Error("failStatus must be 500 or 429");
  return value;
}
function checkMode(value: unknown): EmailFailMode {
  if (value !== "before-store" && value !== "after-store") throw new Error("failMode must be 'before-store' or 'after-store'");
  return value;
}

function resendError(statusCode: number, name: string, message: string): ResendError {
  return { statusCode, name, message };
}

function injectedError(status: EmailFailStatus): { body: ResendError; headers: Record<string, string> } {
  if (status === 429) {
    return {
      body: resendError(429, "rate_limit_exceeded", "Too many requests. You can only make 2 requests per second. (injected by the local fake)"),
      headers: { "retry-after": "1", "ratelimit-limit": "2", "ratelimit-remaining": "0", "ratelimit-reset": "1" },
    };
  }
  return {
    body: resendError(500, "internal_server_error", "An unexpected error occurred. (injected by the local fake)"),
    headers: {},
  };
}

function addressList(value: unknown, field: string, required: boolean): { ok: true; list: string[] | null } | { ok: false; message: string } {
  if (value === undefined || value === null) {
    return required ? { ok: false, message: `Missing \`${field}\` field.` } : { ok: true, list: null };
  }
  const list = typeof value === "string" ? [value] : value;
  if (!Array.isArray(list) || !list.every((a): a is string => typeof a === "string" && a.trim() !== "")) {
    return { ok: false, message: `Invalid \`${field}\` field: expected an address or a list of addresses.` };
  }
  if (required && list.length === 0) return { ok: false, message: `Missing \`${field}\` field.` };
  if (list.length > MAX_RECIPIENTS) return { ok: false, message: `Too many addresses in \`${field}\` (at most ${MAX_RECIPIENTS}).` };
  return { ok: true, list };
}

function optionalString(value: unknown): string | null | undefined {
  if (value === undefined || value === null) return null;
  return typeof value === "string" ? value : undefined;
}

// Minimal validation: the fields Resend itself insists on, with its error names.
function validateEmail(input: unknown): Validated {
  if (!isRecord(input)) return { ok: false, name: "validation_error", message: "The email must be a JSON object." };
  const { from, subject } = input;
  if (typeof from !== "string" || from.trim() === "") return { ok: false, name: "missing_required_field", message: "Missing `from` field." };
  const to = addressList(input.to, "to", true);
  if (!to.ok) return { ok: false, name: to.message.startsWith("Missing") ? "missing_required_field" : "validation_error", message: to.message };
  const hasTemplate = isRecord(input.template);
  if ((typeof subject !== "string" || subject.trim() === "") && !hasTemplate) {
    return { ok: false, name: "missing_required_field", message: "Missing `subject` field." };
  }
  const html = optionalString(input.html);
  const text = optionalString(input.text);
  if (html === undefined) return { ok: false, name: "validation_error", message: "Invalid `html` field: expected a string." };
  if (text === undefined) return { ok: false, name: "validation_error", message: "Invalid `text` field: expected a string." };
  if (html === null && text === null && !hasTemplate) {
    return { ok: false, name: "validation_error", message: "Missing `html` or `text` field." };
  }
  const cc = addressList(input.cc, "cc", false);
  if (!cc.ok) return { ok: false, name: "validation_error", message: cc.message };
  const bcc = addressList(input.bcc, "bcc", false);
  if (!bcc.ok) return { ok: false, name: "validation_error", message: bcc.message };
  const replyTo = addressList(input.reply_to, "reply_to", false);
  if (!replyTo.ok) return { ok: false, name: "validation_error", message: replyTo.message };

  let headers: Record<string, string> | null = null;
  if (input.headers !== undefined && input.headers !== null) {
    if (!isRecord(input.headers) || !Object.values(input.headers).every((v) => typeof v === "string")) {
      return { ok: false, name: "validation_error", message: "Invalid `headers` field: expected an object of strings." };
    }
    headers = input.headers as Record<string, string>;
  }
  let tags: { name: string; value: string }[] | null = null;
  if (input.tags !== undefined && input.tags !== null) {
    if (!Array.isArray(input.tags) || !input.tags.every((t) => isRecord(t) && typeof t.name === "string" && typeof t.value === "string")) {
      return { ok: false, name: "validation_error", message: "Invalid `tags` field: expected a list of { name, value }." };
    }
    tags = (input.tags as Record<string, unknown>[]).map((t) => ({ name: String(t.name), value: String(t.value) }));
  }
  let attachments: unknown[] | null = null;
  if (input.attachments !== undefined && input.attachments !== null) {
    if (!Array.isArray(input.attachments)) return { ok: false, name: "validation_error", message: "Invalid `attachments` field: expected a list." };
    attachments = input.attachments;
  }
  const scheduledAt = optionalString(input.scheduled_at);
  return {
    ok: true,
    email: {
      from,
      to: to.list ?? [],
      cc: cc.list,
      bcc: bcc.list,
      reply_to: replyTo.list,
      subject: typeof subject === "string" ? subject : "",
      html,
      text,
      headers,
      tags,
      attachments,
      scheduled_at: scheduledAt ?? null,
    },
  };
}

function bearerKey(req: IncomingMessage): string | null {
  const header = req.headers.authorization;
  if (header === undefined) return null;
  const match = /^Bearer\s+(.+)$/i.exec(header);
  const key = match?.[1]?.trim();
  return key === undefined || key === "" ? null : key;
}

function fingerprint(path: string, body: unknown): string {
  return createHash("sha256").update(path).update("\n").update(JSON.stringify(body)).digest("hex");
}

function keyFileName(key: string): string {
  // Hashing keeps arbitrary client-chosen keys out of file names.
  return `${createHash("sha256").update(key).digest("hex")}.json`;
}

function sortByCreation(a: StoredEmail, b: StoredEmail): number {
  return a.created_at < b.created_at ? -1 : a.created_at > b.created_at ? 1 : a.id.localeCompare(b.id);
}

export async function startEmailFake(options: EmailFakeOptions = {}): Promise<EmailFake> {
  const env = process.env;
  const port = options.port ?? envNumber(env, "FAKE_EMAIL_PORT") ?? 4010;
  const dir = resolve(options.dir ?? env.FAKE_EMAIL_DIR ?? ".data/fake-email");
  const idempotencyDir = join(dir, IDEMPOTENCY_DIR);
  const faults: EmailFaults = { ...DEFAULT_FAULTS, ...emailFaultsFromEnv(env), ...options.faults };
  checkRate(faults.failRate);
  checkStatus(faults.failStatus);
  checkMode(faults.failMode);
  const stats: EmailFakeStats = { requests: 0, injectedFailures: 0, stored: 0, idempotentReplays: 0 };

  await mkdir(idempotencyDir, { recursive: true });
  const messages = new Map<string, StoredEmail>();
  const idempotency = new Map<string, IdempotencyRecord>();
  await loadFromDisk();

  async function loadFromDisk(): Promise<void> {
    for (const name of await readdir(dir)) {
      if (!name.endsWith(".json")) continue;
      const parsed = parseJson(await readFile(join(dir, name)));
      if (parsed.ok && isRecord(parsed.value) && typeof parsed.value.id === "string") {
        messages.set(parsed.value.id, parsed.value as StoredEmail);
      }
    }
    for (const name of await readdir(idempotencyDir)) {
      if (!name.endsWith(".json")) continue;
      const parsed = parseJson(await readFile(join(idempotencyDir, name)));
      if (parsed.ok && isRecord(parsed.value) && typeof parsed.value.key === "string") {
        idempotency.set(parsed.value.key, parsed.value as IdempotencyRecord);
      }
    }
  }

  function shouldFail(): boolean {
    return faults.failRate > 0 && Math.random() < faults.failRate;
  }

  function failInjected(res: ServerResponse): void {
    stats.injectedFailures += 1;
    const { body, headers } = injectedError(faults.failStatus);
    sendJson(res, body.statusCode, body, headers);
  }

  async function storeAll(emails: StoredEmail[]): Promise<void> {
    await Promise.all(emails.map((email) => writeFileAtomic(join(dir, `${email.id}.json`), JSON.stringify(email, null, 2))));
  }

  /**
   * Shared by /emails and /emails/batch: idempotency replay or store, then the
   * optional after-store fault. `build` returns the messages to store and the answer.
   */
  async function acceptWithIdempotency(
    req: IncomingMessage,
    res: ServerResponse,
    path: string,
    body: unknown,
    build: (idempotencyKey: string | null) => { emails: StoredEmail[]; status: number; answer: unknown },
  ): Promise<void> {
    const rawKey = req.headers["idempotency-key"];
    const key = Array.isArray(rawKey) ? rawKey[0] : rawKey;
    if (key !== undefined && (key.length === 0 || key.length > 256)) {
      sendJson(res, 422, resendError(422, "invalid_idempotency_key", "The key must be between 1-256 chars."));
      return;
    }
    if (key !== undefined) {
      const known = idempotency.get(key);
      const print = fingerprint(path, body);
      if (known !== undefined) {
        if (known.fingerprint !== print) {
          sendJson(res, 409, resendError(409, "invalid_idempotent_request", "Same idempotency key used with a different request payload."));
          return;
        }
        stats.idempotentReplays += 1;
        if (faults.failMode === "after-store" && shouldFail()) return failInjected(res);
        sendJson(res, known.status, known.body);
        return;
      }
      const { emails, status, answer } = build(key);
      // Registered before any await so a concurrent retry with the same key replays instead of storing twice.
      const record: IdempotencyRecord = { key, fingerprint: print, status, body: answer };
      idempotency.set(key, record);
      for (const email of emails) messages.set(email.id, email);
      try {
        await storeAll(emails);
        await writeFileAtomic(join(idempotencyDir, keyFileName(key)), JSON.stringify(record));
      } catch (error) {
        idempotency.delete(key);
        for (const email of emails) messages.delete(email.id);
        throw error;
      }
      stats.stored += emails.length;
      if (faults.failMode === "after-store" && shouldFail()) return failInjected(res);
      sendJson(res, status, answer);
      return;
    }
    const { emails, status, answer } = build(null);
    for (const email of emails) messages.set(email.id, email);
    try {
      await storeAll(emails);
    } catch (error) {
      for (const email of emails) messages.delete(email.id);
      throw error;
    }
    stats.stored += emails.length;
    if (faults.failMode === "after-store" && shouldFail()) return failInjected(res);
    sendJson(res, status, answer);
  }

  function newEmail(
    fields: Omit<StoredEmail, "object" | "id" | "created_at" | "idempotency_key" | "batch_id">,
    idempotencyKey: string | null,
    batchId: string | null,
  ): StoredEmail {
    return {
      object: "email",
      id: randomUUID(),
      created_at: new Date().toISOString(),
      ...fields,
      idempotency_key: idempotencyKey,
      batch_id: batchId,
    };
  }

  async function handleSend(req: IncomingMessage, res: ServerResponse, body: unknown): Promise<void> {
    const checked = validateEmail(body);
    if (!checked.ok) {
      sendJson(res, 422, resendError(422, checked.name, checked.message));
      return;
    }
    await acceptWithIdempotency(req, res, "/emails", body, (key) => {
      const email = newEmail(checked.email, key, null);
      return { emails: [email], status: 200, answer: { id: email.id } };
    });
  }

  async function handleBatch(req: IncomingMessage, res: ServerResponse, body: unknown): Promise<void> {
    if (!Array.isArray(body) || body.length === 0) {
      sendJson(res, 422, resendError(422, "validation_error", "The batch must be a non-empty list of emails."));
      return;
    }
    if (body.length > MAX_BATCH) {
      sendJson(res, 422, resendError(422, "validation_error", `Too many emails in one batch (at most ${MAX_BATCH}).`));
      return;
    }
    const permissive = req.headers["x-batch-validation"] === "permissive";
    const checked = body.map(validateEmail);
    const errors: { index: number; message: string }[] = [];
    checked.forEach((c, index) => {
      if (!c.ok) errors.push({ index, message: c.message });
    });
    if (errors.length > 0 && !permissive) {
      const first = errors[0];
      sendJson(res, 422, resendError(422, "validation_error", `emails[${first?.index ?? 0}]: ${first?.message ?? "invalid"}`));
      return;
    }
    await acceptWithIdempotency(req, res, "/emails/batch", body, (key) => {
      const batchId = randomUUID();
      const emails: StoredEmail[] = [];
      for (const c of checked) if (c.ok) emails.push(newEmail(c.email, key, batchId));
      const answer = permissive ? { data: emails.map((e) => ({ id: e.id })), errors } : { data: emails.map((e) => ({ id: e.id })) };
      return { emails, status: 200, answer };
    });
  }

  async function handleControl(req: IncomingMessage, res: ServerResponse): Promise<void> {
    if (req.method === "GET") {
      sendJson(res, 200, { faults, stats });
      return;
    }
    if (req.method !== "POST") {
      sendJson(res, 405, { error: "use GET or POST" });
      return;
    }
    const parsed = parseJson(await readBody(req, 64 * 1024));
    if (!parsed.ok || !isRecord(parsed.value)) {
      sendJson(res, 400, { error: "body must be a JSON object like { failRate, failStatus, failMode, resetStats }" });
      return;
    }
    const next = { ...faults };
    try {
      if (parsed.value.failRate !== undefined) next.failRate = checkRate(parsed.value.failRate);
      if (parsed.value.failStatus !== undefined) next.failStatus = checkStatus(parsed.value.failStatus);
      if (parsed.value.failMode !== undefined) next.failMode = checkMode(parsed.value.failMode);
    } catch (error) {
      sendJson(res, 400, { error: error instanceof Error ? error.message : "invalid control body" });
      return;
    }
    Object.assign(faults, next);
    if (parsed.value.resetStats === true) Object.assign(stats, { requests: 0, injectedFailures: 0, stored: 0, idempotentReplays: 0 });
    sendJson(res, 200, { faults, stats });
  }

  async function handleMessages(req: IncomingMessage, res: ServerResponse, url: URL): Promise<void> {
    const id = url.pathname.slice("/_messages/".length);
    if (url.pathname === "/_messages" && req.method === "GET") {
      const to = url.searchParams.get("to");
      const list = [...messages.values()].filter((m) => to === null || m.to.includes(to) || (m.cc ?? []).includes(to) || (m.bcc ?? []).includes(to)).sort(sortByCreation);
      sendJson(res, 200, { count: list.length, data: list });
      return;
    }
    if (url.pathname === "/_messages" && req.method === "DELETE") {
      const deleted = messages.size;
      messages.clear();
      idempotency.clear();
      // Only our own files: the folder comes from configuration and may hold other things.
      for (const name of await readdir(dir)) {
        if (name.endsWith(".json")) await rm(join(dir, name), { force: true });
      }
      await rm(idempotencyDir, { recursive: true, force: true });
      await mkdir(idempotencyDir, { recursive: true });
      sendJson(res, 200, { deleted });
      return;
    }
    if (url.pathname.startsWith("/_messages/") && req.method === "GET") {
      const message = messages.get(id);
      if (message === undefined) sendJson(res, 404, { error: "no such message" });
      else sendJson(res, 200, message);
      return;
    }
    sendJson(res, 405, { error: "method not allowed" });
  }

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = new URL(req.url ?? "/", `http://${LOOPBACK}`);
    const path = url.pathname;
    if (path === "/_control") return handleControl(req, res);
    if (path === "/_messages" || path.startsWith("/_messages/")) return handleMessages(req, res, url);

    const isSend = path === "/emails" && req.method === "POST";
    const isBatch = path === "/emails/batch" && req.method === "POST";
    const getMatch = req.method === "GET" ? /^\/emails\/([0-9a-f-]{36})$/.exec(path) : null;
    if (!isSend && !isBatch && getMatch === null) {
      req.resume();
      sendJson(res, 404, resendError(404, "not_found", "The requested endpoint does not exist."));
      return;
    }
    stats.requests += 1;
    if (bearerKey(req) === null) {
      req.resume();
      sendJson(
        res,
        401,
        resendError(401, "missing_api_key", "Missing API key in the authorization header. Include the following header in the request: Authorization: Bearer YOUR_API_KEY"),
      );
      return;
    }
    if (faults.failMode === "before-store" && shouldFail()) {
      req.resume();
      return failInjected(res);
    }
    if (getMatch !== null) {
      const message = messages.get(getMatch[1] ?? "");
      if (message === undefined) sendJson(res, 404, resendError(404, "not_found", "Email not found"));
      else sendJson(res, 200, { ...message, last_event: "delivered" });
      return;
    }
    let raw: Buffer;
    try {
      raw = await readBody(req, MAX_BODY_BYTES);
    } catch (error) {
      if (error instanceof BodyTooLargeError) {
        sendJson(res, 413, resendError(413, "validation_error", `Request body larger than ${MAX_BODY_BYTES} bytes.`));
        return;
      }
      throw error;
    }
    const parsed = parseJson(raw);
    if (!parsed.ok) {
      sendJson(res, 400, resendError(400, "validation_error", "Request body is not valid JSON."));
      return;
    }
    if (isSend) return handleSend(req, res, parsed.value);
    return handleBatch(req, res, parsed.value);
  }

  const running = await listenOnLoopback(handle, port);
  return { url: `http://${LOOPBACK}:${running.port}`, port: running.port, dir, close: running.close };
}

if (isMainModule(import.meta.url)) {
  const fake = await startEmailFake();
  console.log(`email fake listening on ${fake.url} (messages in ${fake.dir})`);
  const stop = (): void => {
    void fake.close().then(() => process.exit(0));
  };
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
}
