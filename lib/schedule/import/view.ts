/**
 * What the import page's client component receives: plain strings, no database ids it has
 * no use for, times as ISO strings.
 */
import type { BlockKind } from "@/db/types";
import type { CheckedFile } from "./service";
import type { ImportFormat, ImportProblem } from "./types";

export interface ImportPreviewRow {
  line: number;
  telescope: string;
  timeZone: string;
  program: string;
  programTitle: string;
  observer: string | null;
  instrument: string | null;
  kind: BlockKind;
  startsAt: string;
  endsAt: string;
}

export interface ImportCheckView {
  fileName: string;
  format: ImportFormat;
  toCreate: ImportPreviewRow[];
  problems: ImportProblem[];
}

export function toCheckView(fileName: string, checked: CheckedFile): ImportCheckView {
  return {
    fileName,
    format: checked.format,
    problems: checked.problems,
    toCreate: checked.toCreate.map((b) => ({
      line: b.line,
      telescope: b.telescope.code,
      timeZone: b.telescope.timeZone,
      program: b.program.code,
      programTitle: b.program.title,
      observer: b.observer?.name ?? null,
      instrument: b.instrument?.code ?? null,
      kind: b.kind,
      startsAt: b.startsAt.toISOString(),
      endsAt: b.endsAt.toISOString(),
    })),
  };
}
