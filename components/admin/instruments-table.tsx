"use client";

import { DataTable, type ColumnDef } from "@/components/ui/data-table";
import type { ActionResult } from "@/lib/actions/result";
import type { Instrument } from "@/lib/instruments/queries";
import { rowActionsColumn } from "./row-actions";

export function InstrumentsTable({ instruments, deleteAction }: { instruments: Instrument[]; deleteAction: (id: string) => Promise<ActionResult> }) {
  const columns: ColumnDef<Instrument>[] = [
    { accessorKey: "telescopeCode", header: "Telescope", cell: ({ row }) => <span className="num">{row.original.telescopeCode}</span> },
    { accessorKey: "code", header: "Code", cell: ({ row }) => <span className="num font-medium">{row.original.code}</span> },
    { accessorKey: "name", header: "Name" },
    { accessorKey: "limitingMagnitude", header: "Limiting mag", meta: { numeric: true } },
    { accessorKey: "blockCount", header: "Blocks", meta: { numeric: true } },
    rowActionsColumn("instrument", (r) => `${r.telescopeCode} ${r.code}`, deleteAction),
  ];
  return (
    <DataTable
      data={instruments}
      columns={columns}
      caption="Instruments"
      filterLabel="Filter instruments"
      getRowId={(i) => i.id}
      initialSort={[{ id: "telescopeCode", desc: false }]}
      emptyText="No instruments yet: create a telescope first, then the first instrument above."
    />
  );
}
