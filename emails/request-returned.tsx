import type { RequestReturnedPayload } from "@/lib/notices/events";
import { utAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Facts, Paragraph, Quote, type Fact } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";

/** To the PI: the director returned the request as a draft; their note says what to change. */
export function RequestReturnedEmail({ payload: p, recipientName, appUrl }: EmailProps<RequestReturnedPayload>) {
  const tz = p.site.timeZone;
  const facts: Fact[] = [
    { label: "Target", value: p.targetName },
    { label: "Program", value: p.programCode },
    { label: "Returned by", value: `${p.returnedBy.name} <${p.returnedBy.email}>` },
    { label: "Returned", value: utAndLocal(p.returnedAt, tz), mono: true },
  ];
  if (p.deadline) facts.push({ label: "Deadline", value: utAndLocal(p.deadline, tz), mono: true });
  return (
    <NoticeLayout
      preview={`${p.returnedBy.name} returned your request for ${p.targetName} with what to change.`}
      heading={`Your ToO request for ${p.targetName} was returned for changes`}
      accent="flare"
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>The director sent your request back to you as a draft. What they ask you to change:</Paragraph>
      <Quote>{p.note}</Quote>
      <Paragraph>
        Edit the request and file it again: until then it is not in the review queue and cannot be scheduled.
        {p.deadline ? " Your deadline still stands." : ""}
      </Paragraph>
      <Facts facts={facts} />
      <ActionLink label="Edit the request" path={`/requests/${p.requestId}`} appUrl={appUrl} />
    </NoticeLayout>
  );
}
