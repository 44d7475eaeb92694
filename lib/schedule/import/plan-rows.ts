/**
 * The pure half of the import planner: given the rows, what the database knows (codes,
 * e-mails) and the blocks already scheduled, decide what would be created and what is
 * wrong with each row. Every problem is reported, not just the first of each row, so one
 * dry run shows the whole list to fix.
 */
import { BLOCK_KINDS, type BlockKind } from "@/db/types";
import { formatUt } from "@/lib/time/format";
import { parseImportTime, type TimeFailure } from "./times";
import { formatOffset } from "./zoned-time";
import { byLine, MAX_NOTES_LENGTH, type ImportFormat, type ImportPlan, type ImportProblem, type ImportRow, type PlannedBlock } from "./types";

export interface CatalogTelescope {
  id: string;
  code: string;
  name: string;
  timeZone: string;
}
export interface CatalogProgram {
  id: string;
  code: string;
  title: string;
  category: BlockKind;
}
export interface CatalogUser {
  id: string;
  name: string;
  email: string;
  disabled: boolean;
}
export interface CatalogInstrument {
  id: string;
  code: string;
  telescopeId: string;
}

/** Lookups keyed by lower-cased code or e-mail: codes match whatever their case. */
export interface ImportCatalog {
  telescopes: Map<string, CatalogTelescope>;
  programs: Map<string, CatalogProgram>;
  users: Map<string, CatalogUser>;
  instruments: Map<string, CatalogInstrument>;
}

export interface ExistingBlock {
  telescopeId: string;
  programCode: string;
  startsAt: Date;
  endsAt: Date;
}

export const instrumentKey = (telescopeId: string, code: string) => `${telescopeId}:${code.toLowerCase()}`;

const KIND_ALIASES: Record<string, BlockKind> = { override: "too", "target of opportunity": "too" };

export function readKind(text: string): BlockKind | null {
  const k = text.trim().toLowerCase();
  if ((BLOCK_KINDS as readonly string[]).includes(k)) return k as BlockKind;
  return KIND_ALIASES[k] ?? null;
}

const WORDS: Record<ImportFormat, { start: string; end: string; zone: string }> = {
  csv: { start: "start", end: "end", zone: "time_zone" },
  ical: { start: "DTSTART", end: "DTEND", zone: "TZID (or the calendar's X-WR-TIMEZONE)" },
};

function timeReason(failure: TimeFailure, which: "start" | "end", row: ImportRow): string {
  const words = WORDS[row.format];
  const label = words[which];
  const raw = row[which];
  switch (failure.kind) {
    case "missing":
      return `The ${label} time is missing.`;
    case "bad":
      return `Bad time in ${label}: "${raw}". Use 2027-03-01T23:00:00Z, 2027-03-01T20:00-03:00, or a local 2027-03-01 20:00 with ${words.zone}.`;
    case "zone_missing":
      return `Time zone missing: ${label} "${raw}" has no offset, so ${words.zone} must name the zone it is in (e.g. America/Santiago).`;
    case "zone_unknown":
      return `Unknown time zone "${row.timeZone}": use an IANA name such as Europe/Madrid or America/Santiago.`;
    case "nonexistent":
      return `${label} ${raw} does not exist in ${row.timeZone}: the clocks skip that hour (daylight saving). Give the time with an offset.`;
    case "ambiguous": {
      const options = failure.offsets.map((o) => `${raw.replace(" ", "T")}${formatOffset(o)}`).join(" or ");
      return `${label} ${raw} happens twice in ${row.timeZone}: the clocks go back that night. Give the time with its offset: ${options}.`;
    }
  }
}

function utRange(start: Date, end: Date): string {
  const a = formatUt(start);
  const b = formatUt(end);
  return `${a}–${a.slice(0, 10) === b.slice(0, 10) ? b.slice(11) : b} UT`;
}

interface Candidate {
  row: ImportRow;
  telescope: CatalogTelescope;
  startsAt: Date;
  endsAt: Date;
}

/** Index of the first block ending after `t` (existing blocks never overlap, so ends are sorted too). */
function firstEndingAfter(blocks: ExistingBlock[], t: number): number {
  let lo = 0;
  let hi = blocks.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((blocks[mid]?.endsAt.getTime() ?? Infinity) > t) hi = mid;
    else lo = mid + 1;
  }
  return lo;
}

function groupBy<T>(items: T[], key: (item: T) => string): Map<string, T[]> {
  const groups = new Map<string, T[]>();
  for (const item of items) {
    const group = groups.get(key(item));
    if (group) group.push(item);
    else groups.set(key(item), [item]);
  }
  return groups;
}

function overlapsWithExisting(candidates: Candidate[], existing: ExistingBlock[], problems: ImportProblem[]) {
  const byTelescope = groupBy(existing, (b) => b.telescopeId);
  for (const list of byTelescope.values()) list.sort((a, b) => a.startsAt.getTime() - b.startsAt.getTime());
  for (const c of candidates) {
    const list = byTelescope.get(c.telescope.id) ?? [];
    const hits: ExistingBlock[] = [];
    for (let i = firstEndingAfter(list, c.startsAt.getTime()); i < list.length; i++) {
      const b = list[i];
      if (!b || b.startsAt >= c.endsAt) break;
      hits.push(b);
    }
    const first = hits[0];
    if (first) {
      const more = hits.length > 1 ? ` and ${hits.length - 1} more` : "";
      problems.push({
        line: c.row.line,
        reason: `Overlaps the existing ${first.programCode} block on ${c.telescope.code}, ${utRange(first.startsAt, first.endsAt)}${more}.`,
      });
    }
  }
}

function overlapsWithinFile(candidates: Candidate[], problems: ImportProblem[]) {
  for (const list of groupBy(candidates, (c) => c.telescope.id).values()) {
    list.sort((a, b) => a.startsAt.getTime() - b.startsAt.getTime() || a.row.line - b.row.line);
    // Sweep in start order, remembering the row that reaches furthest so far.
    let reach: Candidate | undefined;
    for (const c of list) {
      if (reach && c.startsAt < reach.endsAt) {
        problems.push({
          line: c.row.line,
          reason: `Overlaps line ${reach.row.line} of this file on ${c.telescope.code} (${utRange(reach.startsAt, reach.endsAt)}).`,
        });
      }
      if (!reach || c.endsAt > reach.endsAt) reach = c;
    }
  }
}

export function planRows(rows: ImportRow[], catalog: ImportCatalog, existing: ExistingBlock[]): ImportPlan {
  const problems: ImportProblem[] = [];
  const candidates: Candidate[] = [];
  const planned: PlannedBlock[] = [];
  const badLines = new Set<number>();

  for (const row of rows) {
    const before = problems.length;
    const report = (reason: string) => problems.push({ line: row.line, reason });

    const telescope = row.telescope ? catalog.telescopes.get(row.telescope.toLowerCase()) : undefined;
    if (!row.telescope) report("The telescope is missing.");
    else if (!telescope) report(`Unknown telescope "${row.telescope}".`);

    const program = row.program ? catalog.programs.get(row.program.toLowerCase()) : undefined;
    if (!row.program) report("The program is missing.");
    else if (!program) report(`Unknown program "${row.program}".`);

    let observer: CatalogUser | undefined;
    if (row.observerEmail) {
      observer = catalog.users.get(row.observerEmail.toLowerCase());
      if (!observer) report(`Unknown observer "${row.observerEmail}": no user has that e-mail.`);
      else if (observer.disabled) report(`The observer ${observer.email} is disabled.`);
    }

    let instrument: CatalogInstrument | undefined;
    if (row.instrument && telescope) {
      instrument = catalog.instruments.get(instrumentKey(telescope.id, row.instrument));
      if (!instrument) report(`The instrument "${row.instrument}" is not mounted on ${telescope.code}.`);
    }

    const kind = row.kind ? readKind(row.kind) : (program?.category ?? null);
    if (row.kind && !kind) report(`Unknown kind "${row.kind}": use ${BLOCK_KINDS.join(", ")}.`);

    if (row.notes.length > MAX_NOTES_LENGTH) report(`The notes are longer than ${MAX_NOTES_LENGTH} characters.`);

    const start = parseImportTime(row.start, row.timeZone);
    const end = parseImportTime(row.end, row.timeZone);
    if (!start.ok) report(timeReason(start.failure, "start", row));
    // One missing-zone message per row is enough.
    if (!end.ok && !(start.ok === false && start.failure.kind.startsWith("zone") && end.failure.kind === start.failure.kind)) {
      report(timeReason(end.failure, "end", row));
    }
    let times: { startsAt: Date; endsAt: Date } | undefined;
    if (start.ok && end.ok) {
      if (end.instant <= start.instant) {
        report(`The end (${formatUt(end.instant)} UT) must come after the start (${formatUt(start.instant)} UT).`);
      } else {
        times = { startsAt: start.instant, endsAt: end.instant };
      }
    }

    if (telescope && times) candidates.push({ row, telescope, ...times });
    if (problems.length > before) badLines.add(row.line);
    else if (telescope && program && kind && times) {
      planned.push({
        line: row.line,
        telescope: { id: telescope.id, code: telescope.code, name: telescope.name, timeZone: telescope.timeZone },
        program: { id: program.id, code: program.code, title: program.title },
        observer: observer ? { id: observer.id, name: observer.name, email: observer.email } : null,
        instrument: instrument ? { id: instrument.id, code: instrument.code } : null,
        kind,
        ...times,
        notes: row.notes,
      });
    }
  }

  // Overlaps are checked for every row whose telescope and times are readable, even if
  // something else is wrong with it, so that fixing one problem does not reveal another.
  const overlapProblems: ImportProblem[] = [];
  overlapsWithExisting(candidates, existing, overlapProblems);
  overlapsWithinFile(candidates, overlapProblems);
  for (const p of overlapProblems) badLines.add(p.line);
  problems.push(...overlapProblems);

  return {
    toCreate: planned.filter((b) => !badLines.has(b.line)),
    problems: problems.sort(byLine),
  };
}
