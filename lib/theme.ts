export const THEMES = ["day", "night"] as const;
export type Theme = (typeof THEMES)[number];
export const THEME_COOKIE = "nb-theme";

export function parseTheme(value: string | undefined): Theme {
  return value === "night" ? "night" : "day";
}
