/**
 * Nightbreak's look. Surfaces and text come from CSS variables (app/globals.css) so the
 * day, night and night-vision themes share one set of class names. Block kinds have a
 * fixed palette of our own: science slate blue, engineering graphite, discretionary sage,
 * payback violet, and the warm "flare" for every override.
 */
import type { Config } from "tailwindcss";

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./emails/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        surface: "var(--surface)",
        raised: "var(--surface-raised)",
        sunken: "var(--surface-sunken)",
        text: "var(--text)",
        muted: "var(--text-muted)",
        line: "var(--line)",
        focus: "var(--focus)",
        flare: { DEFAULT: "#e8650c", ink: "var(--flare-ink)", soft: "var(--flare-soft)" },
        kind: {
          science: "#4f6fa8",
          engineering: "#4a4f57",
          discretionary: "#7c9a7c",
          too: "#e8650c",
          payback: "#7d5fb8",
        },
        dusk: { 1: "#4d6a94", 2: "#30466f", 3: "#1d2c4c", 4: "#0e1730" },
        danger: "var(--danger)",
        ok: "var(--ok)",
      },
      fontFamily: {
        sans: ["var(--font-sans)", "system-ui", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      fontSize: {
        "2xs": ["0.6875rem", { lineHeight: "1rem" }],
      },
    },
  },
};

export default config;
