import type { PaybackScheduledPayload } from "@/lib/notices/events";
import { formatDuration, formatHours, rangeUtAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Facts, Paragraph, type Fact } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";

/** To the observer: time the program was owed is paid back with this block. */
export function PaybackScheduledEmail({ payload: p, recipientName, appUrl }: EmailProps<PaybackScheduledPayload>) {
  const facts: Fact[] = [
    { label: "Program", value: `${p.programCode} — ${p.programTitle}` },
    { label: "Telescope", value: `${p.telescope.code} (${p.telescope.name}), ${p.site.name}` },
    { label: "When", value: rangeUtAndLocal(p.startsAt, p.endsAt, p.site.timeZone), mono: true },
    { label: "Length", value: formatDuration(p.minutes), mono: true },
    { label: "Owed before", value: formatHours(p.owedBeforeHours), mono: true },
    { label: "Still owed after", value: formatHours(p.owedAfterHours), mono: true },
    { label: "Contact", value: `${p.contact.name} <${p.contact.email}>` },
  ];
  return (
    <NoticeLayout
      preview={`${formatDuration(p.minutes)} on ${p.telescope.code} repay time owed to ${p.programCode}.`}
      heading={`A payback block is scheduled for ${p.programCode}`}
      accent="payback"
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>
        Time that {p.programCode} lost to an override is being paid back: you are the observer of a {formatDuration(p.minutes)} payback
        block on {p.telescope.name}.
      </Paragraph>
      <Facts facts={facts} />
      <ActionLink label="See the time-owed ledger" path="/ledger" appUrl={appUrl} />
    </NoticeLayout>
  );
}
