import type { RequestLapsedPayload } from "@/lib/notices/events";
import { AWAITING_WORDS, formatDuration, lapseSentence, URGENCY_LABELS, utAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Facts, Paragraph, type Fact } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";

/** To the PI: the deadline passed before a decision, so the request lapsed and will not be scheduled. */
export function RequestLapsedEmail({ payload: p, recipientName, appUrl }: EmailProps<RequestLapsedPayload>) {
  const tz = p.site.timeZone;
  const facts: Fact[] = [
    { label: "Target", value: p.targetName },
    { label: "Program", value: p.programCode },
    { label: "Urgency", value: URGENCY_LABELS[p.urgency] },
    { label: "Requested time", value: formatDuration(p.requestedMinutes), mono: true },
  ];
  if (p.telescopes.length > 0) facts.push({ label: "Telescopes", value: p.telescopes.map((t) => `${t.code} (${t.name})`).join(", ") });
  facts.push({ label: "Submitted", value: utAndLocal(p.submittedAt, tz), mono: true });
  facts.push({ label: "Deadline", value: utAndLocal(p.deadline, tz), mono: true });
  facts.push({ label: "Was", value: AWAITING_WORDS[p.fromState] });
  facts.push({ label: "Lapsed", value: utAndLocal(p.lapsedAt, tz), mono: true });
  const sentence = lapseSentence(p);
  return (
    <NoticeLayout
      preview={`Your request for ${p.targetName} lapsed: the deadline passed before a decision.`}
      heading={`Your ToO request for ${p.targetName} lapsed at its deadline`}
      accent="science"
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>{sentence}</Paragraph>
      <Paragraph>
        The request will not be scheduled and no time is charged to {p.programCode}. If the target is still worth observing, file a
        new request with a later deadline.
      </Paragraph>
      <Facts facts={facts} />
      <ActionLink label="Open the request" path={`/requests/${p.requestId}`} appUrl={appUrl} />
    </NoticeLayout>
  );
}
