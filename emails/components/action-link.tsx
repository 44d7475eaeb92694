import { Button, Link, Section, Text } from "@react-email/components";
import { absoluteUrl } from "@/lib/notices/links";
import { colors } from "./theme";

/** The one thing to do next, as a button and as the plain address beneath it. */
export function ActionLink({ label, path, appUrl }: { label: string; path: string; appUrl: string }) {
  const href = absoluteUrl(path, appUrl);
  return (
    <Section style={{ margin: "8px 0 4px" }}>
      <Button href={href} style={{ backgroundColor: colors.ink, borderRadius: 6, color: "#ffffff", fontSize: 14, fontWeight: 600, padding: "10px 16px" }}>
        {label}
      </Button>
      <Text data-skip-in-text="true" style={{ color: colors.muted, fontSize: 12, margin: "8px 0 0" }}>
        <Link href={href} style={{ color: colors.muted }}>
          {href}
        </Link>
      </Text>
    </Section>
  );
}
