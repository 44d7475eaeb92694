/**
 * The red night-vision theme is remembered in its own cookie, apart from the day/night
 * theme (lib/theme.ts): it applies only on tonight's pages, and leaving them brings the
 * person's usual theme back.
 */
export const NIGHT_VISION_COOKIE = "nb-night-vision";

export function parseNightVision(value: string | undefined): boolean {
  return value === "on";
}
