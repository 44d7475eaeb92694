/**
 * The schedule as iCalendar (ical-generator): one VEVENT per block, UID = block id, times
 * in UTC. The X-NIGHTBREAK-* properties, LOCATION, SUMMARY and CATEGORIES follow the import
 * conventions (lib/schedule/import/ical.ts), so an exported calendar imports again.
 */
import ical from "ical-generator";
import type { BlockKind } from "@/db/types";
import type { ExportBlock } from "./queries";

const KIND_LABEL: Record<BlockKind, string> = {
  science: "science",
  engineering: "engineering",
  discretionary: "discretionary",
  too: "override (ToO)",
  payback: "payback",
};

export interface CalendarOptions {
  name: string;
  /** How often subscribers should refresh, in seconds (X-PUBLISHED-TTL). */
  ttlSeconds?: number;
}

function description(b: ExportBlock): string {
  return [
    `Program: ${b.program.code} — ${b.program.title}`,
    `PI: ${b.pi.name} <${b.pi.email}>`,
    `Observer: ${b.observer ? `${b.observer.name} <${b.observer.email}>` : "not assigned"}`,
    `Instrument: ${b.instrument ? `${b.instrument.code} — ${b.instrument.name}` : "not set"}`,
    `Site time zone: ${b.site.timeZone}`,
    ...(b.notes ? [`Notes: ${b.notes}`] : []),
  ].join("\n");
}

function xProperties(b: ExportBlock): Array<[string, string]> {
  const x: Array<[string, string]> = [
    ["X-NIGHTBREAK-TELESCOPE", b.telescope.code],
    ["X-NIGHTBREAK-PROGRAM", b.program.code],
    ["X-NIGHTBREAK-KIND", b.kind],
  ];
  if (b.observer) x.push(["X-NIGHTBREAK-OBSERVER", b.observer.email]);
  if (b.instrument) x.push(["X-NIGHTBREAK-INSTRUMENT", b.instrument.code]);
  if (b.notes) x.push(["X-NIGHTBREAK-NOTES", b.notes]);
  return x;
}

export function blocksToIcal(blocks: ExportBlock[], options: CalendarOptions): string {
  const calendar = ical({
    name: options.name,
    prodId: { company: "Nightbreak", product: "schedule", language: "EN" },
    ttl: options.ttlSeconds ?? null,
  });
  for (const b of blocks) {
    calendar.createEvent({
      id: b.id,
      start: b.startsAt,
      end: b.endsAt,
      // DTSTAMP from the block's last change keeps the output stable between requests.
      stamp: b.updatedAt,
      lastModified: b.updatedAt,
      summary: `${b.program.code} · ${KIND_LABEL[b.kind]}`,
      location: `${b.telescope.code} — ${b.telescope.name}, ${b.site.name}`,
      description: description(b),
      categories: [{ name: b.kind }],
      x: xProperties(b),
    });
  }
  return calendar.toString();
}
