/**
 * The CSV columns of a schedule file — our own names, shared by the importer and the CSV
 * export so that an exported file imports again unchanged.
 *
 * | column          | required | meaning                                                              |
 * |-----------------|----------|----------------------------------------------------------------------|
 * | telescope       | yes      | telescope code, e.g. `AQ-24`                                          |
 * | program         | yes      | program code                                                          |
 * | observer_email  | no       | e-mail of the user scheduled on the block                             |
 * | instrument      | no       | instrument code, mounted on that telescope                            |
 * | kind            | no       | science, engineering, discretionary, too (or override), payback; empty: the program's category |
 * | start           | yes      | `2027-03-01T23:00:00Z`, `2027-03-01T20:00-03:00`, or local `2027-03-01 20:00` |
 * | end             | yes      | as start                                                              |
 * | time_zone       | when a time has no offset | IANA zone for local times, e.g. `America/Santiago`   |
 * | notes           | no       | free text, at most 2000 characters                                    |
 *
 * Header names are matched ignoring case, surrounding spaces, and spaces or hyphens for
 * underscores; an unknown column is an error (it is usually a typo). Comma, semicolon or tab
 * separated; a UTF-8 byte-order mark is ignored. A local time that the clocks skip or repeat
 * at a DST change is refused: give an offset for it instead.
 */
export const IMPORT_COLUMNS = ["telescope", "program", "observer_email", "instrument", "kind", "start", "end", "time_zone", "notes"] as const;
export type ImportColumn = (typeof IMPORT_COLUMNS)[number];

export const REQUIRED_COLUMNS: readonly ImportColumn[] = ["telescope", "program", "start", "end"];

export function normaliseHeader(name: string): string {
  return name.trim().toLowerCase().replace(/[\s-]+/g, "_");
}

export function isImportColumn(name: string): name is ImportColumn {
  return (IMPORT_COLUMNS as readonly string[]).includes(name);
}
