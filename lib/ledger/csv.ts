/** The ledger as CSV (papaparse): one line per program and semester, minutes and hours. */
import Papa from "papaparse";
import { hours, type ProgramBalance } from "./balances";

export const LEDGER_CSV_COLUMNS = [
  "semester",
  "partner",
  "program",
  "title",
  "charged_minutes",
  "credited_minutes",
  "repaid_minutes",
  "owed_minutes",
  "owed_hours",
] as const;

const round2 = (x: number) => Math.round(x * 100) / 100;

export function ledgerCsv(programs: readonly ProgramBalance[]): string {
  return Papa.unparse(
    {
      fields: [...LEDGER_CSV_COLUMNS],
      data: programs.map((p) => [
        p.semesterCode,
        p.partnerCode,
        p.programCode,
        p.programTitle,
        round2(p.chargedMinutes),
        round2(p.creditedMinutes),
        round2(p.repaidMinutes),
        round2(p.owedMinutes),
        hours(p.owedMinutes),
      ]),
    },
    { newline: "\r\n", escapeFormulae: true },
  );
}

export function ledgerCsvFileName(now: Date, semesterCode?: string): string {
  return `nightbreak-ledger${semesterCode ? `-${semesterCode}` : ""}-${now.toISOString().slice(0, 10)}.csv`;
}
