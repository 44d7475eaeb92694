/**
 * Small node:http helpers shared by the local fakes (e-mail and uploads).
 * The fakes bind to loopback only and hold everything they receive on disk.
 */
import { createServer, type IncomingMessage, type Server, type ServerResponse } from "node:http";
import { rename, writeFile } from "node:fs/promises";
import { resolve } from "node:path";
import { fileURLToPath } from "node:url";

export const LOOPBACK = "127.0.0.1";

export class BodyTooLargeError extends Error {
  constructor(readonly limit: number) {
    super(`request body larger than ${limit} bytes`);
  }
}

export async function readBody(req: IncomingMessage, limit: number): Promise<Buffer> {
  const declared = Number(req.headers["content-length"] ?? "0");
  if (declared > limit) {
    req.resume();
    throw new BodyTooLargeError(limit);
  }
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of req) {
    const buf = chunk as Buffer;
    total += buf.length;
    // Keep draining so the client sees our answer instead of a reset socket.
    if (total > limit) continue;
    chunks.push(buf);
  }
  if (total > limit) throw new BodyTooLargeError(limit);
  return Buffer.concat(chunks);
}

export function sendJson(
  res: ServerResponse,
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): void {
  if (res.headersSent) {
    res.end();
    return;
  }
  const text = JSON.stringify(body);
  res.writeHead(status, {
    "content-type": "application/json; charset=utf-8",
    "content-length": Buffer.byteLength(text).toString(),
    "cache-control": "no-store",
    ...headers,
  });
  res.end(text);
}

export function parseJson(buf: Buffer): { ok: true; value: unknown } | { ok: false } {
  try {
    return { ok: true, value: JSON.parse(buf.toString("utf8")) as unknown };
  } catch {
    return { ok: false };
  }
}

export function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

/** Writes through a temporary file so a reader never sees half a JSON document. */
export async function writeFileAtomic(path: string, data: string | Buffer): Promise<void> {
  const tmp = `${path}.${process.pid}.${Math.random().toString(36).slice(2)}.tmp`;
  await writeFile(tmp, data);
  await rename(tmp, path);
}

export type RunningServer = { server: Server; port: number; close: () => Promise<void> };

export async function listenOnLoopback(
  handler: (req: IncomingMessage, res: ServerResponse) => Promise<void>,
  port: number,
  onClose: () => void = () => {},
): Promise<RunningServer> {
  const server = createServer((req, res) => {
    handler(req, res).catch((error: unknown) => {
      const message = error instanceof Error ? error.message : String(error);
      if (!res.headersSent) sendJson(res, 500, { error: `fake server error: ${message}` });
      else res.end();
    });
  });
  await new Promise<void>((resolveListen, rejectListen) => {
    server.once("error", rejectListen);
    server.listen(port, LOOPBACK, () => {
      server.off("error", rejectListen);
      resolveListen();
    });
  });
  const address = server.address();
  if (address === null || typeof address === "string") throw new Error("fake server has no TCP address");
  let closing: Promise<void> | undefined;
  const close = (): Promise<void> => {
    closing ??= new Promise<void>((resolveClose) => {
      onClose();
      server.close(() => resolveClose());
      // Held-open responses and keep-alive sockets would otherwise keep close() waiting.
      server.closeAllConnections();
    });
    return closing;
  };
  return { server, port: address.port, close };
}

export function envNumber(env: Record<string, string | undefined>, name: string): number | undefined {
  const raw = env[name];
  if (raw === undefined || raw.trim() === "") return undefined;
  const value = Number(raw);
  if (!Number.isFinite(value)) throw new Error(`${name} must be a number, got '${raw}'`);
  return value;
}

/** True when the module was started directly (`npx tsx scripts/fakes/x.ts`), not imported. */
export function isMainModule(importMetaUrl: string): boolean {
  const entry = process.argv[1];
  if (entry === undefined) return false;
  return fileURLToPath(importMetaUrl) === resolve(entry);
}
