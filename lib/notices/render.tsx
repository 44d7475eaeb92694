/**
 * Turns a notice into the e-mail that is sent: subject (the in-app title), HTML from the
 * React e-mail template, and the plain-text version derived from that HTML. Rendering
 * depends only on the payload, the recipient's name and APP_URL, so a retry sends the
 * same bytes (the mail service rejects a reused idempotency key with a different body).
 */
import { render, toPlainText } from "@react-email/components";
import { BlockDisplacedEmail } from "@/emails/block-displaced";
import { DecisionMadeEmail } from "@/emails/decision-made";
import { OutcomeLoggedEmail } from "@/emails/outcome-logged";
import { PaybackScheduledEmail } from "@/emails/payback-scheduled";
import { RequestLapsedEmail } from "@/emails/request-lapsed";
import { RequestReturnedEmail } from "@/emails/request-returned";
import { RequestSubmittedEmail } from "@/emails/request-submitted";
import { TonightChangedEmail } from "@/emails/tonight-changed";
import { describeNotice } from "./describe";
import type { NoticeOf } from "./events";

export interface RenderedEmail {
  subject: string;
  html: string;
  text: string;
}

export interface RenderContext {
  recipientName: string;
  appUrl: string;
}

// Fact tables read as aligned columns; headings keep their case.
const TEXT_OPTIONS = {
  selectors: [
    { selector: "table.fact-row", format: "dataTable", options: { colSpacing: 2, maxColumnWidth: 200, uppercaseHeaderCells: false } },
    { selector: "h1", options: { uppercase: false } },
  ],
};

function element(notice: NoticeOf, ctx: RenderContext): React.ReactElement {
  switch (notice.event) {
    case "request_submitted":
      return <RequestSubmittedEmail payload={notice.payload} {...ctx} />;
    case "decision_made":
      return <DecisionMadeEmail payload={notice.payload} {...ctx} />;
    case "block_displaced":
      return <BlockDisplacedEmail payload={notice.payload} {...ctx} />;
    case "tonight_changed":
      return <TonightChangedEmail payload={notice.payload} {...ctx} />;
    case "payback_scheduled":
      return <PaybackScheduledEmail payload={notice.payload} {...ctx} />;
    case "outcome_logged":
      return <OutcomeLoggedEmail payload={notice.payload} {...ctx} />;
    case "request_lapsed":
      return <RequestLapsedEmail payload={notice.payload} {...ctx} />;
    case "request_returned":
      return <RequestReturnedEmail payload={notice.payload} {...ctx} />;
  }
}

/** Whom a reply reaches: the director named in the notice, or the night assistant who logged an outcome. */
export function replyToFor(notice: NoticeOf): string | null {
  const email = replyAddress(notice);
  return email.includes("@") ? email : null;
}

function replyAddress(notice: NoticeOf): string {
  switch (notice.event) {
    case "decision_made":
      return notice.payload.decidedBy.email;
    case "request_returned":
      return notice.payload.returnedBy.email;
    case "block_displaced":
    case "payback_scheduled":
      return notice.payload.contact.email;
    case "outcome_logged":
      return notice.payload.loggedBy.email;
    default:
      return "";
  }
}

export async function renderNoticeEmail(notice: NoticeOf, ctx: RenderContext): Promise<RenderedEmail> {
  const html = await render(element(notice, ctx));
  return { subject: describeNotice(notice).title, html, text: toPlainText(html, TEXT_OPTIONS) };
}
