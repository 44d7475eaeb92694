"use client";

import { DataTable, type ColumnDef } from "@/components/ui/data-table";
import type { ActionResult } from "@/lib/actions/result";
import type { Site } from "@/lib/sites/queries";
import { rowActionsColumn } from "./row-actions";

export function SitesTable({ sites, deleteAction }: { sites: Site[]; deleteAction: (id: string) => Promise<ActionResult> }) {
  const columns: ColumnDef<Site>[] = [
    { accessorKey: "code", header: "Code", cell: ({ row }) => <span className="num font-medium">{row.original.code}</span> },
    { accessorKey: "name", header: "Name" },
    { accessorKey: "latitudeDeg", header: "Latitude °", meta: { numeric: true } },
    { accessorKey: "longitudeDeg", header: "E longitude °", meta: { numeric: true } },
    { accessorKey: "heightM", header: "Height m", meta: { numeric: true } },
    { accessorKey: "timeZone", header: "Time zone" },
    { accessorKey: "telescopeCount", header: "Telescopes", meta: { numeric: true } },
    rowActionsColumn("site", (r) => r.code, deleteAction),
  ];
  return <DataTable data={sites} columns={columns} caption="Sites" filterLabel="Filter sites" getRowId={(s) => s.id} initialSort={[{ id: "code", desc: false }]} emptyText="No sites yet: create the first above." />;
}
