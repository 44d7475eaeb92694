import type { RequestSubmittedPayload } from "@/lib/notices/events";
import { formatDuration, URGENCY_LABELS, rangeUtAndLocal, utAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Facts, Paragraph, Quote, type Fact } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";

/** To directors: a ToO request waits in the review queue. */
export function RequestSubmittedEmail({ payload: p, recipientName, appUrl }: EmailProps<RequestSubmittedPayload>) {
  const tz = p.site.timeZone;
  const facts: Fact[] = [
    { label: "Target", value: p.targetName },
    { label: "Program", value: `${p.programCode} — ${p.programTitle}` },
    { label: "PI", value: p.piName },
    { label: "Urgency", value: URGENCY_LABELS[p.urgency] },
    { label: "Requested time", value: formatDuration(p.requestedMinutes), mono: true },
    { label: "Telescopes", value: p.telescopes.map((t) => `${t.code} (${t.name})`).join(", ") },
    { label: "Submitted", value: utAndLocal(p.submittedAt, tz), mono: true },
  ];
  if (p.deadline) facts.push({ label: "Deadline", value: utAndLocal(p.deadline, tz), mono: true });
  facts.push({
    label: "First window",
    value: p.firstWindow ? `${rangeUtAndLocal(p.firstWindow.startsAt, p.firstWindow.endsAt, tz)} at ${p.site.name}` : "none found by the feasibility check",
    mono: p.firstWindow !== null,
  });
  return (
    <NoticeLayout
      preview={`${p.piName} asks for ${formatDuration(p.requestedMinutes)} on ${p.targetName}, urgency ${URGENCY_LABELS[p.urgency]}.`}
      heading={`ToO request for ${p.targetName} is waiting for review`}
      accent="flare"
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>
        {p.piName} submitted a target-of-opportunity override request for {p.programCode}. It is in the review queue with its
        feasibility and displacement impact.
      </Paragraph>
      <Facts facts={facts} />
      {p.justification.trim() !== "" && <Quote>{p.justification}</Quote>}
      <ActionLink label="Review the request" path={`/review/${p.requestId}`} appUrl={appUrl} />
    </NoticeLayout>
  );
}
