/**
 * Where a notice leads. In-app notices store the app-relative path; e-mails need an
 * absolute URL, built from APP_URL (or NEXTAUTH_URL) so links work from a mail client.
 */
import type { NoticeOf } from "./events";

export function appBaseUrl(env: Record<string, string | undefined> = process.env): string {
  const base = env.APP_URL || env.NEXTAUTH_URL || "http://localhost:3000";
  return base.replace(/\/+$/, "");
}

export function absoluteUrl(path: string, base: string): string {
  return `${base}${path.startsWith("/") ? path : `/${path}`}`;
}

/** The page that answers "what do I do about this?" for each event. */
export function noticeLink(notice: NoticeOf): string {
  switch (notice.event) {
    case "request_submitted":
      return `/review/${notice.payload.requestId}`;
    case "decision_made":
    case "outcome_logged":
    case "request_lapsed":
    case "request_returned":
      return `/requests/${notice.payload.requestId}`;
    case "block_displaced":
    case "payback_scheduled":
      return "/ledger";
    case "tonight_changed":
      return `/tonight/${encodeURIComponent(notice.payload.telescope.code)}`;
  }
}

export const PREFERENCES_PATH = "/notices#preferences";
