"use client";

import { DataTable, type ColumnDef } from "@/components/ui/data-table";
import type { ProgramBalance } from "@/lib/ledger/balances";
import { formatDuration } from "@/lib/time/format";

const minutesCell = (v: number) => (v === 0 ? "—" : formatDuration(v));

const COLUMNS: ColumnDef<ProgramBalance>[] = [
  { accessorKey: "programCode", header: "Program", cell: ({ row }) => <><span className="num font-medium">{row.original.programCode}</span> <span className="text-muted">{row.original.programTitle}</span></> },
  { accessorKey: "partnerCode", header: "Partner", cell: ({ getValue }) => <span className="num">{String(getValue())}</span> },
  { accessorKey: "semesterCode", header: "Semester", cell: ({ getValue }) => <span className="num">{String(getValue())}</span> },
  { accessorKey: "chargedMinutes", header: "Charged", meta: { numeric: true }, enableGlobalFilter: false, cell: ({ getValue }) => minutesCell(getValue<number>()) },
  { accessorKey: "creditedMinutes", header: "Credited", meta: { numeric: true }, enableGlobalFilter: false, cell: ({ getValue }) => minutesCell(getValue<number>()) },
  { accessorKey: "repaidMinutes", header: "Repaid", meta: { numeric: true }, enableGlobalFilter: false, cell: ({ getValue }) => minutesCell(getValue<number>()) },
  {
    accessorKey: "owedMinutes",
    header: "Still owed",
    meta: { numeric: true },
    enableGlobalFilter: false,
    cell: ({ getValue }) => {
      const v = getValue<number>();
      return v > 0 ? <strong>{formatDuration(v)}</strong> : "—";
    },
  },
];

/** Per program and semester: ToO time charged, displaced time credited, payback repaid, the balance owed. */
export function ProgramBalancesTable({ programs }: { programs: ProgramBalance[] }) {
  return (
    <DataTable
      data={programs}
      columns={COLUMNS}
      caption="Time owed per program"
      filterLabel="Filter programs"
      getRowId={(p) => `${p.semesterId}:${p.programId}`}
      initialSort={[{ id: "owedMinutes", desc: true }]}
      pageSize={20}
      emptyText="Nothing on the ledger yet: no override has displaced scheduled time."
    />
  );
}
