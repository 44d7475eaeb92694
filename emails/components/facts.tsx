import { Column, Row, Section, Text } from "@react-email/components";
import { colors, fonts } from "./theme";

export interface Fact {
  label: string;
  value: string;
  /** Times, coordinates and numbers are set in the monospace face so they align. */
  mono?: boolean;
}

/** A two-column table of label and value. */
export function Facts({ facts }: { facts: Fact[] }) {
  return (
    <Section style={{ margin: "8px 0 16px" }}>
      {facts.map((f, i) => (
        <Row key={i} className="fact-row">
          <Column style={{ color: colors.muted, fontSize: 13, padding: "3px 12px 3px 0", verticalAlign: "top", whiteSpace: "nowrap", width: 150 }}>
            {f.label}
          </Column>
          <Column style={{ fontFamily: f.mono ? fonts.mono : fonts.sans, fontSize: 13, padding: "3px 0", verticalAlign: "top" }}>{f.value}</Column>
        </Row>
      ))}
    </Section>
  );
}

export function Paragraph({ children }: { children: React.ReactNode }) {
  return <Text style={{ fontSize: 14, lineHeight: "21px", margin: "0 0 12px" }}>{children}</Text>;
}

/** A quoted block of someone else's words (a decision's reason, a justification). */
export function Quote({ children }: { children: React.ReactNode }) {
  return (
    <Text style={{ borderLeft: `3px solid ${colors.line}`, color: colors.ink, fontSize: 14, lineHeight: "21px", margin: "0 0 16px", padding: "2px 0 2px 12px", whiteSpace: "pre-line" }}>
      {children}
    </Text>
  );
}
