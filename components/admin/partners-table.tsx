"use client";

import { DataTable, type ColumnDef } from "@/components/ui/data-table";
import type { ActionResult } from "@/lib/actions/result";
import type { Partner } from "@/lib/partners/queries";
import { rowActionsColumn } from "./row-actions";

export function PartnersTable({ partners, deleteAction }: { partners: Partner[]; deleteAction: (id: string) => Promise<ActionResult> }) {
  const columns: ColumnDef<Partner>[] = [
    { accessorKey: "code", header: "Code", cell: ({ row }) => <span className="num font-medium">{row.original.code}</span> },
    { accessorKey: "name", header: "Name" },
    { accessorKey: "programCount", header: "Programs", meta: { numeric: true } },
    rowActionsColumn("partner", (r) => r.code, deleteAction),
  ];
  return (
    <DataTable
      data={partners}
      columns={columns}
      caption="Partners"
      filterLabel="Filter partners"
      getRowId={(p) => p.id}
      initialSort={[{ id: "code", desc: false }]}
      emptyText="No partners yet: create the first above."
    />
  );
}
