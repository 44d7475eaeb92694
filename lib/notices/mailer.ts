/**
 * Sending one e-mail through the Resend SDK. The SDK never throws on HTTP errors: it
 * resolves to `{ error }` with `statusCode` (null for a network failure). We sort those
 * into retryable (network, timeout, 408, 429, 5xx, and the 409 for a concurrent request
 * with the same idempotency key: the queue tries again later) and permanent (any other
 * 4xx: retrying cannot help). The client is created on first use, never at import,
 * because the constructor throws without an API key.
 */
import { Resend } from "resend";

export interface OutgoingEmail {
  from: string;
  to: string;
  subject: string;
  html: string;
  text: string;
  replyTo: string | null;
  tags: Array<{ name: string; value: string }>;
}

export type SendOutcome =
  | { ok: true; providerId: string }
  | { ok: false; retryable: boolean; status: number | null; message: string };

export interface Mailer {
  send(email: OutgoingEmail, idempotencyKey: string): Promise<SendOutcome>;
}

export function classifySendError(error: { statusCode?: number | null; name?: string; message?: string }): Extract<SendOutcome, { ok: false }> {
  const status = typeof error.statusCode === "number" ? error.statusCode : null;
  // 409 concurrent_idempotent_requests: the same key is still in flight from an attempt
  // that overlaps this one (a job handed out again after it expired). Not a refusal:
  // trying again later gets the first request's answer.
  const retryable = status === null || status === 408 || status === 429 || status >= 500 || error.name === "concurrent_idempotent_requests";
  const message = `${status ?? "network"} ${error.name ?? "error"}: ${error.message ?? "no message"}`.slice(0, 1000);
  return { ok: false, retryable, status, message };
}

export interface ResendMailerConfig {
  apiKey: string;
  /** Defaults to RESEND_BASE_URL, then Resend's own API. */
  baseUrl?: string;
  timeoutMs: number;
}

export function createResendMailer(config: ResendMailerConfig): Mailer {
  let client: Resend | undefined;
  return {
    async send(email, idempotencyKey) {
      client ??= new Resend(config.apiKey, config.baseUrl ? { baseUrl: config.baseUrl } : undefined);
      const { data, error } = await client.emails.send(
        {
          from: email.from,
          to: [email.to],
          subject: email.subject,
          html: email.html,
          text: email.text,
          ...(email.replyTo ? { replyTo: email.replyTo } : {}),
          tags: email.tags,
        },
        // An aborted request resolves as a network error (statusCode null): retryable.
        { idempotencyKey, signal: AbortSignal.timeout(config.timeoutMs) },
      );
      if (error) return classifySendError(error);
      if (!data?.id) return { ok: false, retryable: true, status: null, message: "the mail service answered without an id" };
      return { ok: true, providerId: data.id };
    },
  };
}

/** From the environment: RESEND_API_KEY (required to send), RESEND_BASE_URL (a local fake in dev and tests). */
export function mailerFromEnv(timeoutMs: number, env: Record<string, string | undefined> = process.env): Mailer | null {
  const apiKey = env.RESEND_API_KEY;
  if (!apiKey) return null;
  return createResendMailer({ apiKey, baseUrl: env.RESEND_BASE_URL || undefined, timeoutMs });
}

export function senderAddress(env: Record<string, string | undefined> = process.env): string {
  return env.EMAIL_FROM || "Nightbreak override desk <desk@nightbreak.test>";
}
