/**
 * Time-owed balances from ledger rows, pure. Minutes throughout. Per program and
 * semester: charged (ToO time the program used), credited (owed to it for displaced
 * time, at the consortium's ratio), repaid (payback blocks), and the balance still owed,
 * credited − repaid. Partner and semester lines are sums of their programs' lines.
 */

export interface LedgerRow {
  semesterId: string;
  semesterCode: string;
  partnerId: string;
  partnerCode: string;
  partnerName: string;
  programId: string;
  programCode: string;
  programTitle: string;
  chargedMinutes: number;
  creditedMinutes: number;
  repaidMinutes: number;
}

export interface Balance {
  chargedMinutes: number;
  creditedMinutes: number;
  repaidMinutes: number;
  owedMinutes: number;
}

export interface ProgramBalance extends LedgerRow, Balance {}
export interface PartnerBalance extends Balance {
  partnerId: string;
  partnerCode: string;
  partnerName: string;
  semesterId: string;
  semesterCode: string;
}
export interface SemesterBalance extends Balance {
  semesterId: string;
  semesterCode: string;
}

export interface LedgerSummary {
  programs: ProgramBalance[];
  partners: PartnerBalance[];
  semesters: SemesterBalance[];
  totals: Balance;
}

const zero = (): Balance => ({ chargedMinutes: 0, creditedMinutes: 0, repaidMinutes: 0, owedMinutes: 0 });

function add(into: Balance, row: Balance): void {
  into.chargedMinutes += row.chargedMinutes;
  into.creditedMinutes += row.creditedMinutes;
  into.repaidMinutes += row.repaidMinutes;
  into.owedMinutes += row.owedMinutes;
}

export function owedOf(row: Pick<LedgerRow, "creditedMinutes" | "repaidMinutes">): number {
  return row.creditedMinutes - row.repaidMinutes;
}

export function summarizeLedger(rows: readonly LedgerRow[]): LedgerSummary {
  const programs = rows
    .map((r): ProgramBalance => ({ ...r, owedMinutes: owedOf(r) }))
    .sort((a, b) => a.semesterCode.localeCompare(b.semesterCode) || a.partnerCode.localeCompare(b.partnerCode) || a.programCode.localeCompare(b.programCode));
  const partners = new Map<string, PartnerBalance>();
  const semesters = new Map<string, SemesterBalance>();
  const totals = zero();
  for (const p of programs) {
    const pk = `${p.semesterId}:${p.partnerId}`;
    const partner = partners.get(pk) ?? { partnerId: p.partnerId, partnerCode: p.partnerCode, partnerName: p.partnerName, semesterId: p.semesterId, semesterCode: p.semesterCode, ...zero() };
    add(partner, p);
    partners.set(pk, partner);
    const semester = semesters.get(p.semesterId) ?? { semesterId: p.semesterId, semesterCode: p.semesterCode, ...zero() };
    add(semester, p);
    semesters.set(p.semesterId, semester);
    add(totals, p);
  }
  return { programs, partners: [...partners.values()], semesters: [...semesters.values()], totals };
}

/** "12 h 30 min" style, for minutes that may be fractional. */
export function hours(minutes: number): number {
  return Math.round((minutes / 60) * 100) / 100;
}
