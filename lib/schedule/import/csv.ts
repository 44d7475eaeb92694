/**
 * Reads a schedule CSV (columns in ./columns.ts) into ImportRows. Never throws: anything
 * wrong with the file becomes a problem with the line it starts on, so one bad quote or an
 * odd byte cannot hide the rest of the report.
 */
import Papa from "papaparse";
import { IMPORT_COLUMNS, isImportColumn, normaliseHeader, REQUIRED_COLUMNS, type ImportColumn } from "./columns";
import { MAX_IMPORT_ROWS, type ImportProblem, type ImportRow, type ParsedFile } from "./types";

type Columns = Partial<Record<ImportColumn, number>>;

// The CSV export escapes cells that a spreadsheet would run as a formula with a leading
// apostrophe; take it off again so an export re-imports unchanged.
function unescapeFormula(cell: string): string {
  return /^'[=+\-@\t\r]/.test(cell) ? cell.slice(1) : cell;
}

function readHeader(cells: string[], problems: ImportProblem[]): Columns | null {
  const columns: Columns = {};
  cells.forEach((raw, index) => {
    const name = normaliseHeader(raw);
    if (!name) return;
    if (!isImportColumn(name)) {
      problems.push({ line: 1, reason: `Unknown column "${raw.trim()}". The columns are: ${IMPORT_COLUMNS.join(", ")}.` });
    } else if (columns[name] !== undefined) {
      problems.push({ line: 1, reason: `The column "${name}" appears twice.` });
    } else {
      columns[name] = index;
    }
  });
  const missing = REQUIRED_COLUMNS.filter((c) => columns[c] === undefined);
  if (missing.length) {
    problems.push({ line: 1, reason: `Missing column${missing.length > 1 ? "s" : ""}: ${missing.join(", ")}. The first line must name the columns.` });
  }
  return problems.length ? null : columns;
}

function papaReason(error: Papa.ParseError): string {
  if (error.code === "MissingQuotes") return "A quoted cell starting here is never closed: every opening \" needs a closing one.";
  if (error.code === "InvalidQuotes") return "Malformed quotes: inside a quoted cell, write a quote as \"\".";
  return `Unreadable row: ${error.message}.`;
}

function toRow(cells: string[], columns: Columns, line: number): ImportRow {
  const cell = (c: ImportColumn) => {
    const index = columns[c];
    return index === undefined ? "" : unescapeFormula((cells[index] ?? "").trim());
  };
  return {
    line,
    format: "csv",
    telescope: cell("telescope"),
    program: cell("program"),
    observerEmail: cell("observer_email"),
    instrument: cell("instrument"),
    kind: cell("kind"),
    start: cell("start"),
    end: cell("end"),
    timeZone: cell("time_zone"),
    notes: cell("notes"),
  };
}

/** Counts line breaks (\r\n, \n or \r) in text[from, to). */
function countBreaks(text: string, from: number, to: number): number {
  let n = 0;
  for (let i = from; i < to; i++) {
    const c = text.charCodeAt(i);
    if (c === 10) n++;
    else if (c === 13 && text.charCodeAt(i + 1) !== 10) n++;
  }
  return n;
}

export function parseScheduleCsv(input: string): ParsedFile {
  const text = input.replace(/^\uFEFF/, "");
  const rows: ImportRow[] = [];
  const problems: ImportProblem[] = [];
  if (!text.trim()) return { format: "csv", rows, problems: [{ line: 0, reason: "The file is empty." }] };

  let columns: Columns | null | undefined;
  let headerWidth = 0;
  let rowStart = 0;
  let line = 1;
  let records = 0;
  let stopped = false;
  try {
    Papa.parse<string[]>(text, {
      header: false,
      skipEmptyLines: false,
      delimitersToGuess: [",", ";", "\t"],
      step(result, parser) {
        // The cursor points just past this record (its line break included).
        const cursor = result.meta.cursor;
        const thisLine = line;
        line += countBreaks(text, rowStart, cursor);
        rowStart = cursor;
        const cells = result.data.map((c) => String(c));
        const errors = result.errors.filter((e) => e.code !== "UndetectableDelimiter");
        if (columns === undefined) {
          columns = readHeader(cells, problems);
          headerWidth = cells.length;
          if (!columns) parser.abort();
          return;
        }
        if (!columns) return;
        if (cells.every((c) => !c.trim())) return;
        if (++records > MAX_IMPORT_ROWS) {
          problems.push({ line: thisLine, reason: `Too many rows: a file may hold at most ${MAX_IMPORT_ROWS} blocks. Split it into several files.` });
          stopped = true;
          parser.abort();
          return;
        }
        const first = errors[0];
        if (first) {
          problems.push({ line: thisLine, reason: papaReason(first) });
          return;
        }
        if (cells.length > headerWidth) {
          problems.push({ line: thisLine, reason: `This row has ${cells.length} cells but the header names ${headerWidth}: quote any cell that contains the separator.` });
          return;
        }
        rows.push(toRow(cells, columns, thisLine));
      },
    });
  } catch (error) {
    problems.push({ line, reason: `The file could not be read as CSV (${error instanceof Error ? error.message : "unknown error"}).` });
  }
  if (!stopped && columns && !rows.length && !problems.length) problems.push({ line: 0, reason: "The file has a header but no rows." });
  return { format: "csv", rows, problems };
}
