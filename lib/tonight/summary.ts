const SUMMARY_CHARS = 240;

/** The first paragraph, cut at a word boundary: enough to recognise the case at a glance. */
export function summarise(text: string, max = SUMMARY_CHARS): string {
  const first = text.trim().split(/\n\s*\n/)[0]?.replace(/\s+/g, " ") ?? "";
  if (first.length <= max) return first;
  const cut = first.slice(0, max);
  const space = cut.lastIndexOf(" ");
  return `${(space > max * 0.6 ? cut.slice(0, space) : cut).replace(/[\s,;:.]+$/, "")}…`;
}
