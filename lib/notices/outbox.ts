/**
 * The development outbox: what the local e-mail fake (scripts/fakes/email-server.ts)
 * has captured, and its fault-injection control. Only ever talks to a fake on the
 * loopback interface; against the real mail service there is no outbox to show.
 */
import { z } from "zod";

const LOOPBACK_HOSTS = new Set(["127.0.0.1", "localhost", "[::1]"]);

/** RESEND_BASE_URL when it points at this machine, else null. */
export function localFakeUrl(env: Record<string, string | undefined> = process.env): string | null {
  const raw = env.RESEND_BASE_URL;
  if (!raw) return null;
  try {
    const url = new URL(raw);
    return url.protocol === "http:" && LOOPBACK_HOSTS.has(url.hostname) ? url.origin : null;
  } catch {
    return null;
  }
}

const capturedSchema = z.object({
  id: z.string(),
  created_at: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  reply_to: z.array(z.string()).nullable().optional(),
  subject: z.string(),
  html: z.string().nullable(),
  text: z.string().nullable(),
  idempotency_key: z.string().nullable().optional(),
  tags: z.array(z.object({ name: z.string(), value: z.string() })).nullable().optional(),
});

export interface CapturedEmail {
  id: string;
  createdAt: Date;
  from: string;
  to: string[];
  replyTo: string[];
  subject: string;
  html: string | null;
  text: string | null;
  idempotencyKey: string | null;
  event: string | null;
}

function toCaptured(raw: z.infer<typeof capturedSchema>): CapturedEmail {
  return {
    id: raw.id,
    createdAt: new Date(raw.created_at),
    from: raw.from,
    to: raw.to,
    replyTo: raw.reply_to ?? [],
    subject: raw.subject,
    html: raw.html,
    text: raw.text,
    idempotencyKey: raw.idempotency_key ?? null,
    event: raw.tags?.find((t) => t.name === "event")?.value ?? null,
  };
}

async function getJson(url: string): Promise<unknown> {
  const response = await fetch(url, { cache: "no-store", signal: AbortSignal.timeout(5_000) });
  if (!response.ok) throw new Error(`${url} answered ${response.status}`);
  return response.json() as Promise<unknown>;
}

/** Newest first. */
export async function listCapturedEmails(baseUrl: string, limit = 100): Promise<{ total: number; emails: CapturedEmail[] }> {
  const body = z.object({ count: z.number(), data: z.array(capturedSchema) }).parse(await getJson(`${baseUrl}/_messages`));
  const emails = body.data.map(toCaptured).reverse().slice(0, limit);
  return { total: body.count, emails };
}

export async function getCapturedEmail(baseUrl: string, id: string): Promise<CapturedEmail | null> {
  const response = await fetch(`${baseUrl}/_messages/${encodeURIComponent(id)}`, { cache: "no-store", signal: AbortSignal.timeout(5_000) });
  if (response.status === 404) return null;
  if (!response.ok) throw new Error(`the e-mail fake answered ${response.status}`);
  return toCaptured(capturedSchema.parse(await response.json()));
}

export const fakeFaultsSchema = z.object({
  failRate: z.coerce.number().min(0).max(1),
  failStatus: z.coerce.number().pipe(z.union([z.literal(500), z.literal(429)])),
  failMode: z.enum(["before-store", "after-store"]),
});
export type FakeFaults = z.infer<typeof fakeFaultsSchema>;

const controlSchema = z.object({
  faults: fakeFaultsSchema,
  stats: z.object({ requests: z.number(), injectedFailures: z.number(), stored: z.number(), idempotentReplays: z.number() }),
});
export type FakeControl = z.infer<typeof controlSchema>;

export async function getFakeControl(baseUrl: string): Promise<FakeControl> {
  return controlSchema.parse(await getJson(`${baseUrl}/_control`));
}

export async function setFakeFaults(baseUrl: string, faults: FakeFaults): Promise<FakeControl> {
  const response = await fetch(`${baseUrl}/_control`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(faults),
    signal: AbortSignal.timeout(5_000),
  });
  if (!response.ok) throw new Error(`the e-mail fake refused the setting (${response.status})`);
  return controlSchema.parse(await response.json());
}
