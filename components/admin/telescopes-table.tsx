"use client";

import { DataTable, type ColumnDef } from "@/components/ui/data-table";
import type { ActionResult } from "@/lib/actions/result";
import type { Telescope } from "@/lib/telescopes/queries";
import { rowActionsColumn } from "./row-actions";

const hours = (h: number) => `${h > 0 ? "+" : ""}${h}`;

export function TelescopesTable({ telescopes, deleteAction }: { telescopes: Telescope[]; deleteAction: (id: string) => Promise<ActionResult> }) {
  const columns: ColumnDef<Telescope>[] = [
    { accessorKey: "code", header: "Code", cell: ({ row }) => <span className="num font-medium">{row.original.code}</span> },
    { accessorKey: "name", header: "Name" },
    { accessorKey: "siteCode", header: "Site", cell: ({ row }) => <span className="num">{row.original.siteCode}</span> },
    { accessorKey: "apertureM", header: "Aperture m", meta: { numeric: true } },
    { accessorKey: "minAltitudeDeg", header: "Min alt °", meta: { numeric: true } },
    { accessorKey: "maxAirmass", header: "Max airmass", meta: { numeric: true } },
    { accessorKey: "sunAvoidanceDeg", header: "Sun avoid °", meta: { numeric: true } },
    {
      id: "hourAngle",
      header: "Hour angle h",
      accessorFn: (t) => `${hours(t.hourAngleMinH)} … ${hours(t.hourAngleMaxH)}`,
      enableSorting: false,
      meta: { numeric: true },
    },
    { accessorKey: "setupMinutes", header: "Setup min", meta: { numeric: true } },
    { id: "assistants", header: "Night assistants", accessorFn: (t) => t.assistants.map((a) => a.name).join(", ") },
    { accessorKey: "instrumentCount", header: "Instruments", meta: { numeric: true } },
    rowActionsColumn("telescope", (r) => r.code, deleteAction),
  ];
  return (
    <DataTable
      data={telescopes}
      columns={columns}
      caption="Telescopes"
      filterLabel="Filter telescopes"
      getRowId={(t) => t.id}
      initialSort={[{ id: "code", desc: false }]}
      emptyText="No telescopes yet: create a site first, then the first telescope above."
    />
  );
}
