"use client";

import { DataTable, type ColumnDef } from "@/components/ui/data-table";
import type { ActionResult } from "@/lib/actions/result";
import type { Semester } from "@/lib/semesters/queries";
import { formatUt } from "@/lib/time/format";
import { rowActionsColumn } from "./row-actions";

const DAY_MS = 86_400_000;

export function SemestersTable({ semesters, deleteAction }: { semesters: Semester[]; deleteAction: (id: string) => Promise<ActionResult> }) {
  const columns: ColumnDef<Semester>[] = [
    { accessorKey: "code", header: "Code", cell: ({ row }) => <span className="num font-medium">{row.original.code}</span> },
    // "YYYY-MM-DD HH:MM" strings sort and filter in time order.
    { id: "startsAt", header: "Starts UT", accessorFn: (s) => formatUt(s.startsAt), meta: { numeric: true } },
    { id: "endsAt", header: "Ends UT", accessorFn: (s) => formatUt(s.endsAt), meta: { numeric: true } },
    { id: "days", header: "Days", accessorFn: (s) => Math.round((s.endsAt.getTime() - s.startsAt.getTime()) / DAY_MS), meta: { numeric: true } },
    { accessorKey: "programCount", header: "Programs", meta: { numeric: true } },
    rowActionsColumn("semester", (r) => r.code, deleteAction),
  ];
  return (
    <DataTable
      data={semesters}
      columns={columns}
      caption="Semesters"
      filterLabel="Filter semesters"
      getRowId={(s) => s.id}
      initialSort={[{ id: "startsAt", desc: true }]}
      emptyText="No semesters yet: create the first above."
    />
  );
}
