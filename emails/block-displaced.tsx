import type { BlockDisplacedPayload } from "@/lib/notices/events";
import { formatDuration, formatHours, rangeUtAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Facts, Paragraph, type Fact } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";

/** To the observer: what they lose, by how much, what they are owed, and whom to ask. */
export function BlockDisplacedEmail({ payload: p, recipientName, appUrl }: EmailProps<BlockDisplacedPayload>) {
  const tz = p.site.timeZone;
  const whole = p.remaining.length === 0;
  const facts: Fact[] = [
    { label: "Program", value: `${p.programCode} — ${p.programTitle}` },
    { label: "Telescope", value: `${p.telescope.code} (${p.telescope.name}), ${p.site.name}` },
    { label: "Your block", value: rangeUtAndLocal(p.block.startsAt, p.block.endsAt, tz), mono: true },
    ...p.lost.map((l, i) => ({ label: i === 0 ? "Given to the override" : "", value: rangeUtAndLocal(l.startsAt, l.endsAt, tz), mono: true })),
    { label: "Time lost", value: formatDuration(p.lostMinutes), mono: true },
    ...(whole
      ? [{ label: "What remains", value: "nothing: the whole block went to the override" }]
      : p.remaining.map((r, i) => ({ label: i === 0 ? "What remains" : "", value: rangeUtAndLocal(r.startsAt, r.endsAt, tz), mono: true }))),
    { label: "Owed to the program", value: `${formatHours(p.owedHours)} on the time-owed ledger`, mono: true },
    { label: "Contact", value: `${p.contact.name} <${p.contact.email}>` },
  ];
  return (
    <NoticeLayout
      preview={`${formatDuration(p.lostMinutes)} of your ${p.programCode} block on ${p.telescope.code} go to an override; ${formatHours(p.owedHours)} are owed back.`}
      heading={whole ? `Your block on ${p.telescope.code} was given to an override` : `Your block on ${p.telescope.code} was shortened by ${formatDuration(p.lostMinutes)}`}
      accent="flare"
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>
        A director approved a target-of-opportunity override for {p.targetName}. It takes {formatDuration(p.lostMinutes)} of your
        scheduled {p.programCode} time. The program is credited {formatHours(p.owedHours)} on the time-owed ledger, to be repaid by a
        payback block later in the semester; you will be told when it is scheduled.
      </Paragraph>
      <Facts facts={facts} />
      <Paragraph>
        Questions about the override or the payback go to {p.contact.name} ({p.contact.email}); replying to this e-mail reaches them.
      </Paragraph>
      <ActionLink label="See what the program is owed" path="/ledger" appUrl={appUrl} />
    </NoticeLayout>
  );
}
