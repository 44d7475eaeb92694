// E-mail clients ignore our CSS variables and fonts: plain inline values, the day theme's.
export const colors = {
  paper: "#fbfaf7",
  raised: "#ffffff",
  ink: "#1b1f27",
  muted: "#5b6270",
  line: "#dcd8cf",
  flare: "#e8650c",
  flareSoft: "#fde9d8",
  science: "#4f6fa8",
  payback: "#7d5fb8",
} as const;

export const fonts = {
  sans: "-apple-system, 'Segoe UI', Helvetica, Arial, sans-serif",
  mono: "'JetBrains Mono', ui-monospace, Menlo, Consolas, monospace",
} as const;
