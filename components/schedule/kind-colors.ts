import type { BlockKind } from "@/db/types";

/** Block colours on the calendar: our palette (see tailwind.config.ts `kind`). */
export const KIND_COLORS: Record<BlockKind, { background: string; text: string }> = {
  science: { background: "#4f6fa8", text: "#ffffff" },
  engineering: { background: "#4a4f57", text: "#ffffff" },
  discretionary: { background: "#7c9a7c", text: "#0b0f0b" },
  too: { background: "#e8650c", text: "#140800" },
  payback: { background: "#7d5fb8", text: "#ffffff" },
};

export const KIND_LABELS: Record<BlockKind, string> = {
  science: "Science",
  engineering: "Engineering",
  discretionary: "Discretionary",
  too: "Override",
  payback: "Payback",
};

/** Translucent dusk blues: stacked, they darken from sunset to astronomical night. */
export const TWILIGHT_COLORS = {
  sunset: "rgba(77, 106, 148, 0.14)",
  civil: "rgba(48, 70, 111, 0.16)",
  nautical: "rgba(29, 44, 76, 0.18)",
  astronomical: "rgba(14, 23, 48, 0.22)",
} as const;
