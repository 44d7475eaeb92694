"use client";

import Link from "next/link";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import type { ColumnDef } from "@/components/ui/data-table";
import type { ActionResult } from "@/lib/actions/result";

/**
 * Edit and Delete for one table row. Delete asks once more in place (no browser dialog),
 * and a refusal ("still has 3 telescopes") is shown beside the buttons.
 */
export function RowActions({ editHref, label, onDelete }: { editHref: string; label: string; onDelete: () => Promise<ActionResult> }) {
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();

  function remove() {
    startTransition(async () => {
      let answer: ActionResult;
      try {
        answer = await onDelete();
      } catch {
        answer = { ok: false, message: "Something went wrong on our side; nothing was deleted." };
      }
      setConfirming(false);
      setError(answer.ok ? null : answer.message);
    });
  }

  return (
    <div className="flex flex-col items-end gap-1">
      <div className="flex items-center gap-2">
        <Link href={editHref} aria-label={`Edit ${label}`} className="text-sm underline hover:text-muted">
          Edit
        </Link>
        {confirming ? (
          <>
            <Button type="button" variant="danger" className="px-2 py-0.5" disabled={pending} onClick={remove} aria-label={`Confirm deleting ${label}`}>
              {pending ? "Deleting…" : "Confirm delete"}
            </Button>
            <Button type="button" variant="quiet" className="px-2 py-0.5" disabled={pending} onClick={() => setConfirming(false)}>
              Keep
            </Button>
          </>
        ) : (
          <Button type="button" variant="quiet" className="px-2 py-0.5" onClick={() => setConfirming(true)} aria-label={`Delete ${label}`}>
            Delete
          </Button>
        )}
      </div>
      {error && (
        <p role="alert" className="max-w-xs text-right text-xs text-danger">
          {error}
        </p>
      )}
    </div>
  );
}

/** The Edit/Delete column of an admin table: `noun` names the page (/admin/<noun>s) and the row. */
export function rowActionsColumn<T extends { id: string }>(
  noun: string,
  label: (row: T) => string,
  deleteAction: (id: string) => Promise<ActionResult>,
): ColumnDef<T> {
  return {
    id: "actions",
    header: () => <span className="sr-only">Actions</span>,
    enableSorting: false,
    enableGlobalFilter: false,
    cell: ({ row }) => (
      <RowActions editHref={`/admin/${noun}s?edit=${row.original.id}`} label={`${noun} ${label(row.original)}`} onDelete={() => deleteAction(row.original.id)} />
    ),
  };
}
