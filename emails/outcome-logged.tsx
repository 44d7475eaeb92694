import type { OutcomeLoggedPayload } from "@/lib/notices/events";
import { formatDuration, OUTCOME_WORDS, outcomeSentence, rangeUtAndLocal, SETTLED_STATE_WORDS, utAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Facts, Paragraph, Quote, type Fact } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";

/** To the PI: what the night log says happened to their ToO block, and what that made of the request. */
export function OutcomeLoggedEmail({ payload: p, recipientName, appUrl }: EmailProps<OutcomeLoggedPayload>) {
  const tz = p.site.timeZone;
  const observed = p.requestState !== "not_executed";
  const note = p.note.trim();
  const facts: Fact[] = [
    { label: "Target", value: p.targetName },
    { label: "Program", value: p.programCode },
    { label: "Telescope", value: `${p.telescope.code} (${p.telescope.name}), ${p.site.name}` },
    { label: "Block", value: rangeUtAndLocal(p.block.startsAt, p.block.endsAt, tz), mono: true },
    { label: "Outcome", value: OUTCOME_WORDS[p.outcome] },
  ];
  if (p.minutesUsed !== null) facts.push({ label: "Time observed", value: formatDuration(p.minutesUsed), mono: true });
  facts.push({ label: "Request is now", value: SETTLED_STATE_WORDS[p.requestState] });
  facts.push({ label: "Logged by", value: `${p.loggedBy.name} <${p.loggedBy.email}>` });
  facts.push({ label: "Logged", value: utAndLocal(p.loggedAt, tz), mono: true });
  const sentence = outcomeSentence(p);
  return (
    <NoticeLayout
      preview={sentence}
      heading={`Your override for ${p.targetName}: ${OUTCOME_WORDS[p.outcome]}`}
      accent={observed ? "flare" : "science"}
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>{sentence}</Paragraph>
      {note ? (
        <>
          <Paragraph>The night assistant&apos;s note:</Paragraph>
          <Quote>{note}</Quote>
        </>
      ) : (
        <Paragraph>The night assistant left no note.</Paragraph>
      )}
      <Facts facts={facts} />
      <ActionLink label="Open the request" path={`/requests/${p.requestId}`} appUrl={appUrl} />
    </NoticeLayout>
  );
}
