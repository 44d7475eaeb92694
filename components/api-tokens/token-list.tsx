"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import type { ActionResult } from "@/lib/actions/result";
import type { ApiToken } from "@/lib/api-tokens/queries";
import { formatUt } from "@/lib/time/format";

export function TokenList({ tokens, revoke }: { tokens: ApiToken[]; revoke: (input: unknown) => Promise<ActionResult> }) {
  const router = useRouter();
  const [pending, startTransition] = useTransition();
  const [message, setMessage] = useState<ActionResult | null>(null);
  if (tokens.length === 0) return <EmptyState>You have no API tokens.</EmptyState>;
  return (
    <div className="flex flex-col gap-2">
      <div className="scroll-cue overflow-x-auto rounded-lg border border-line bg-raised">
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Your API tokens</caption>
          <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
            <tr>
              <th scope="col" className="px-3 py-2 font-medium">Name</th>
              <th scope="col" className="px-3 py-2 font-medium">Starts with</th>
              <th scope="col" className="px-3 py-2 font-medium">Created (UT)</th>
              <th scope="col" className="px-3 py-2 font-medium">Last used (UT)</th>
              <th scope="col" className="px-3 py-2 font-medium">
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {tokens.map((t) => (
              <tr key={t.id} className="border-t border-line">
                <td className="px-3 py-2">{t.name}</td>
                <td className="num px-3 py-2">{t.prefix}…</td>
                <td className="num px-3 py-2">{formatUt(t.createdAt)}</td>
                <td className="num px-3 py-2">{t.lastUsedAt ? formatUt(t.lastUsedAt) : "never"}</td>
                <td className="px-3 py-2 text-right">
                  {t.revokedAt ? (
                    <span className="text-xs text-muted">revoked {formatUt(t.revokedAt)}</span>
                  ) : (
                    <Button
                      type="button"
                      variant="danger"
                      disabled={pending}
                      aria-label={`Revoke ${t.name}`}
                      onClick={() =>
                        startTransition(async () => {
                          const answer = await revoke({ id: t.id });
                          setMessage(answer);
                          router.refresh();
                        })
                      }
                    >
                      Revoke
                    </Button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {message && (
        <p role="status" className={message.ok ? "text-sm text-ok" : "text-sm text-danger"}>
          {message.message}
        </p>
      )}
    </div>
  );
}
