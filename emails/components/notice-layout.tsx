import { Body, Container, Head, Heading, Hr, Html, Link, Preview, Section, Text } from "@react-email/components";
import { absoluteUrl, PREFERENCES_PATH } from "@/lib/notices/links";
import { colors, fonts } from "./theme";

export type Accent = "flare" | "science" | "payback";

const accentColor: Record<Accent, string> = { flare: colors.flare, science: colors.science, payback: colors.payback };

/** The frame every notice e-mail shares: heading, greeting, body, why-you-got-this footer. */
export function NoticeLayout({
  preview,
  heading,
  accent,
  recipientName,
  appUrl,
  children,
}: {
  preview: string;
  heading: string;
  accent: Accent;
  recipientName: string;
  appUrl: string;
  children: React.ReactNode;
}) {
  return (
    <Html lang="en">
      <Head />
      <Preview>{preview}</Preview>
      <Body style={{ backgroundColor: colors.paper, color: colors.ink, fontFamily: fonts.sans, margin: 0, padding: "24px 0" }}>
        <Container style={{ backgroundColor: colors.raised, border: `1px solid ${colors.line}`, borderTop: `4px solid ${accentColor[accent]}`, maxWidth: 600, padding: "20px 28px" }}>
          <Text style={{ color: colors.muted, fontSize: 12, letterSpacing: 1, margin: 0, textTransform: "uppercase" }}>Nightbreak · override desk</Text>
          <Heading as="h1" style={{ fontSize: 20, lineHeight: "28px", margin: "8px 0 16px" }}>
            {heading}
          </Heading>
          <Text style={{ fontSize: 14, margin: "0 0 12px" }}>Hello {recipientName},</Text>
          {children}
          <Hr style={{ borderColor: colors.line, margin: "24px 0 12px" }} />
          <Section>
            <Text style={{ color: colors.muted, fontSize: 12, lineHeight: "18px", margin: 0 }}>
              Times are in UT, with the site&apos;s local time in brackets. You receive this e-mail because of your role at the
              consortium; the same notice is in Nightbreak under Notices. Choose which notices reach you by e-mail:{" "}
              <Link href={absoluteUrl(PREFERENCES_PATH, appUrl)} style={{ color: colors.muted }}>
                notice preferences
              </Link>
              .
            </Text>
          </Section>
        </Container>
      </Body>
    </Html>
  );
}

/** What every notice template receives. */
export interface EmailProps<P> {
  payload: P;
  recipientName: string;
  appUrl: string;
}
