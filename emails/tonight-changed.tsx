import { Column, Row, Section } from "@react-email/components";
import type { TonightChangedPayload, TonightChangeKind } from "@/lib/notices/events";
import { rangeUtAndLocal } from "@/lib/notices/format";
import { ActionLink } from "./components/action-link";
import { Paragraph } from "./components/facts";
import { NoticeLayout, type EmailProps } from "./components/notice-layout";
import { colors, fonts } from "./components/theme";

const KIND_LABELS: Record<TonightChangeKind, string> = {
  added: "Added",
  shortened: "Shortened",
  split: "Split",
  removed: "Removed",
};

/** To the night assistants of one telescope: every change to tonight's queue, in order. */
export function TonightChangedEmail({ payload: p, recipientName, appUrl }: EmailProps<TonightChangedPayload>) {
  const tz = p.site.timeZone;
  const changes = [...p.changes].sort((a, b) => a.startsAt.getTime() - b.startsAt.getTime());
  return (
    <NoticeLayout
      preview={`${changes.length} change${changes.length === 1 ? "" : "s"} to the queue on ${p.telescope.code} for the night of ${p.nightOf}.`}
      heading={`Tonight's queue on ${p.telescope.code} changed`}
      accent="flare"
      recipientName={recipientName}
      appUrl={appUrl}
    >
      <Paragraph>
        The queue of {p.telescope.name} at {p.site.name} for the night of {p.nightOf} changed
        {p.targetName ? ` for a target-of-opportunity override on ${p.targetName}` : ""}. Please acknowledge the changes in tonight&apos;s
        queue.
      </Paragraph>
      <Section style={{ margin: "8px 0 16px" }}>
        {changes.map((c, i) => (
          <Row key={i} className="fact-row" style={{ borderTop: `1px solid ${colors.line}` }}>
            <Column style={{ color: c.kind === "added" ? colors.flare : colors.ink, fontSize: 13, fontWeight: 600, padding: "4px 10px 4px 0", width: 80 }}>
              {KIND_LABELS[c.kind]}
            </Column>
            <Column style={{ fontSize: 13, padding: "4px 10px 4px 0", width: 130 }}>
              {c.programCode}
              {c.label ? ` · ${c.label}` : ""}
            </Column>
            <Column style={{ fontFamily: fonts.mono, fontSize: 12, padding: "4px 0" }}>{rangeUtAndLocal(c.startsAt, c.endsAt, tz)}</Column>
          </Row>
        ))}
      </Section>
      <Paragraph>
        The schedule is a plan: the decision to open, point or close the telescope stays with you and the observatory&apos;s operating
        procedures and safety rules.
      </Paragraph>
      <ActionLink label="Open tonight's queue" path={`/tonight/${encodeURIComponent(p.telescope.code)}`} appUrl={appUrl} />
    </NoticeLayout>
  );
}
