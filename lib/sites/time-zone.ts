/**
 * Sites keep an IANA time-zone name ("America/Santiago"): local times and "night of" dates
 * depend on it, DST included. Intl knows the zones; we only accept Area/Location names
 * (and UTC), not abbreviations such as "CLT" or fixed offsets such as "-03:00".
 */
let listed: Map<string, string> | undefined;

function listedZones(): Map<string, string> {
  listed ??= new Map(Intl.supportedValuesOf("timeZone").map((zone) => [zone.toLowerCase(), zone]));
  return listed;
}

/** The zone's name as Intl spells it, or undefined when it is not a time zone we accept. */
export function canonicalTimeZone(name: string): string | undefined {
  const trimmed = name.trim();
  const known = listedZones().get(trimmed.toLowerCase());
  if (known) return known;
  // Links such as "Asia/Calcutta" are valid IANA names that the canonical list leaves out.
  if (trimmed.toUpperCase() !== "UTC" && !/^[A-Za-z]+(?:\/[A-Za-z0-9_+-]+)+$/.test(trimmed)) return undefined;
  try {
    return new Intl.DateTimeFormat("en-GB", { timeZone: trimmed }).resolvedOptions().timeZone;
  } catch {
    return undefined;
  }
}

export function listTimeZones(): string[] {
  return [...listedZones().values()];
}
