import type { DecisionMadePayload } from "@/lib/notices/events";
import { formatDuration, rangeUtAndLocal, utAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Facts, Paragraph, Quote, type Fact } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";

/** To the PI: approved (with the slot) or declined, always with the director's reason. */
export function DecisionMadeEmail({ payload: p, recipientName, appUrl }: EmailProps<DecisionMadePayload>) {
  const tz = p.site.timeZone;
  const approved = p.decision === "approved";
  const facts: Fact[] = [
    { label: "Target", value: p.targetName },
    { label: "Program", value: p.programCode },
    { label: "Decision", value: approved ? "approved" : "declined" },
    { label: "Decided by", value: `${p.decidedBy.name} <${p.decidedBy.email}>` },
    { label: "Decided", value: utAndLocal(p.decidedAt, tz), mono: true },
  ];
  if (p.slot) {
    facts.push({ label: "Telescope", value: `${p.slot.telescope.code} (${p.slot.telescope.name}), ${p.site.name}` });
    facts.push({ label: "Slot", value: rangeUtAndLocal(p.slot.startsAt, p.slot.endsAt, tz), mono: true });
    facts.push({
      label: "Displaced",
      value: p.displacedMinutes > 0 ? `${formatDuration(p.displacedMinutes)} of scheduled time` : "no scheduled science",
      mono: p.displacedMinutes > 0,
    });
  }
  return (
    <NoticeLayout
      preview={`${p.decidedBy.name} ${p.decision} your request for ${p.targetName}.`}
      heading={`Your ToO request for ${p.targetName} was ${p.decision}`}
      accent={approved ? "flare" : "science"}
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>
        {approved
          ? "The override is on the schedule. The night assistant sees it in tonight's queue."
          : "The request will not be scheduled. The director's reason:"}
      </Paragraph>
      {approved && <Paragraph>The director&apos;s reason:</Paragraph>}
      <Quote>{p.reason}</Quote>
      <Facts facts={facts} />
      <ActionLink label="Open the request" path={`/requests/${p.requestId}`} appUrl={appUrl} />
    </NoticeLayout>
  );
}
