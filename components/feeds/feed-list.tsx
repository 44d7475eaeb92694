"use client";

import { useState, useTransition } from "react";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import type { ActionResult } from "@/lib/actions/result";
import { formatUt } from "@/lib/time/format";

export interface FeedListItem {
  id: string;
  label: string;
  createdAt: string;
  revokedAt: string | null;
}

export function FeedList({ feeds, revoke }: { feeds: FeedListItem[]; revoke: (input: unknown) => Promise<ActionResult> }) {
  const [result, setResult] = useState<ActionResult | null>(null);
  const [pending, startTransition] = useTransition();
  if (!feeds.length) return <EmptyState>No feeds yet.</EmptyState>;

  function revokeOne(feedId: string) {
    startTransition(async () => setResult(await revoke({ feedId })));
  }

  return (
    <div className="flex flex-col gap-3">
      <table className="w-full text-left text-sm">
        <thead className="text-2xs uppercase tracking-wide text-muted">
          <tr>
            <th className="py-1 pr-3 font-medium">Feed</th>
            <th className="py-1 pr-3 font-medium">Created</th>
            <th className="py-1 pr-3 font-medium">State</th>
            <th className="py-1 font-medium"><span className="sr-only">Actions</span></th>
          </tr>
        </thead>
        <tbody>
          {feeds.map((f) => (
            <tr key={f.id} className="border-t border-line align-top">
              <td className="py-1.5 pr-3">{f.label}</td>
              <td className="num py-1.5 pr-3 whitespace-nowrap">{formatUt(new Date(f.createdAt))} UT</td>
              <td className="py-1.5 pr-3">{f.revokedAt ? <span className="text-muted">Revoked {formatUt(new Date(f.revokedAt)).slice(0, 10)}</span> : "Active"}</td>
              <td className="py-1.5 text-right">
                {!f.revokedAt && (
                  <Button type="button" variant="danger" disabled={pending} aria-label={`Revoke ${f.label}`} onClick={() => revokeOne(f.id)}>
                    Revoke
                  </Button>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      {result && <Alert tone={result.ok ? "ok" : "error"}>{result.message}</Alert>}
    </div>
  );
}
