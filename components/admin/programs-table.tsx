"use client";

import { KindBadge } from "@/components/schedule/kind-badge";
import { DataTable, type ColumnDef } from "@/components/ui/data-table";
import type { ActionResult } from "@/lib/actions/result";
import type { Program } from "@/lib/programs/queries";
import { CATEGORY_LABELS } from "@/lib/programs/schemas";
import { rowActionsColumn } from "./row-actions";

export function ProgramsTable({ programs, deleteAction }: { programs: Program[]; deleteAction: (id: string) => Promise<ActionResult> }) {
  const columns: ColumnDef<Program>[] = [
    { accessorKey: "code", header: "Code", cell: ({ row }) => <span className="num font-medium">{row.original.code}</span> },
    { accessorKey: "title", header: "Title" },
    { accessorKey: "semesterCode", header: "Semester", cell: ({ row }) => <span className="num">{row.original.semesterCode}</span> },
    { accessorKey: "partnerCode", header: "Partner", cell: ({ row }) => <span className="num">{row.original.partnerCode}</span> },
    { accessorKey: "piName", header: "PI" },
    { accessorKey: "rank", header: "Rank", meta: { numeric: true } },
    { accessorKey: "allocatedHours", header: "Hours", meta: { numeric: true } },
    // Filtering matches the label people read ("ToO"), sorting the stored value.
    { id: "category", header: "Category", accessorFn: (p) => CATEGORY_LABELS[p.category], cell: ({ row }) => <KindBadge kind={row.original.category} /> },
    { id: "tooAllowed", header: "ToO allowed", accessorFn: (p) => (p.tooAllowed ? "yes" : "no") },
    { id: "observers", header: "Observers", accessorFn: (p) => p.observers.map((o) => o.name).join(", ") },
    rowActionsColumn("program", (r) => r.code, deleteAction),
  ];
  return (
    <DataTable
      data={programs}
      columns={columns}
      caption="Programs"
      filterLabel="Filter programs"
      getRowId={(p) => p.id}
      initialSort={[{ id: "code", desc: false }]}
      emptyText="No programs yet: create a semester and a partner first, then the first program above."
    />
  );
}
