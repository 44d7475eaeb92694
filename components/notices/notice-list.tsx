"use client";

import Link from "next/link";
import { useState, useTransition } from "react";
import type { ActionResult } from "@/lib/actions/result";
import { cn } from "@/lib/cn";
import { formatUt } from "@/lib/time/format";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { refreshUnreadCount } from "./unread-count";

export interface NoticeItem {
  id: string;
  title: string;
  body: string;
  link: string;
  createdAt: string;
  read: boolean;
}

type Action = (input: unknown) => Promise<ActionResult>;

/** The person's notices, newest first; unread ones in bold with the flare mark. Opening one marks it read. */
export function NoticeList({ notices, markRead, markAllRead }: { notices: NoticeItem[]; markRead: Action; markAllRead: Action }) {
  const [pending, startTransition] = useTransition();
  const [error, setError] = useState<string | null>(null);
  const unread = notices.filter((n) => !n.read).length;

  function run(action: Action, input: unknown) {
    startTransition(async () => {
      const answer = await action(input);
      setError(answer.ok ? null : answer.message);
      refreshUnreadCount();
    });
  }

  if (notices.length === 0) return <EmptyState>No notices yet. Requests, decisions and schedule changes that concern you appear here.</EmptyState>;
  return (
    <div>
      <div className="mb-3 flex items-center justify-between gap-3">
        <p className="text-sm text-muted" aria-live="polite">
          {unread === 0 ? "All read." : `${unread} unread`}
        </p>
        <Button variant="quiet" disabled={pending || unread === 0} onClick={() => run(markAllRead, {})}>
          Mark all read
        </Button>
      </div>
      {error && (
        <p role="alert" className="mb-2 text-sm text-danger">
          {error}
        </p>
      )}
      <ul className="divide-y divide-line rounded-lg border border-line bg-raised">
        {notices.map((n) => (
          <li key={n.id} className={cn("flex flex-wrap items-start gap-3 px-4 py-3", !n.read && "border-l-4 border-l-flare-ink")}>
            <div className="min-w-0 flex-1">
              <p className={cn("text-sm", n.read ? "text-text" : "font-semibold")}>
                <Link href={n.link} onClick={() => !n.read && run(markRead, { id: n.id })} className="hover:underline">
                  {n.title}
                </Link>
              </p>
              <p className="mt-0.5 text-sm text-muted">{n.body}</p>
              <p className="num mt-1 text-2xs text-muted">
                <time dateTime={n.createdAt}>{formatUt(new Date(n.createdAt))} UT</time>
              </p>
            </div>
            {!n.read && (
              <Button variant="quiet" className="text-xs" disabled={pending} onClick={() => run(markRead, { id: n.id })} aria-label={`Mark read: ${n.title}`}>
                Mark read
              </Button>
            )}
          </li>
        ))}
      </ul>
    </div>
  );
}
