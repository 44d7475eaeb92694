"use client";

import Link from "next/link";
import useSWR from "swr";
import { cn } from "@/lib/cn";
import { fetchUnreadCount, UNREAD_COUNT_KEY } from "./unread-count";

/** The header bell: unread notices, polled every 15 s and on focus. */
export function NoticeBell() {
  const { data: unread = 0 } = useSWR(UNREAD_COUNT_KEY, fetchUnreadCount, { refreshInterval: 15_000, revalidateOnFocus: true });
  const label = unread === 0 ? "Notices, none unread" : `Notices, ${unread} unread`;
  return (
    <Link href="/notices" aria-label={label} title={label} className="relative inline-flex items-center text-muted hover:text-text">
      <svg viewBox="0 0 24 24" width="20" height="20" fill="none" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" strokeLinejoin="round" aria-hidden="true">
        <path d="M6 8a6 6 0 0 1 12 0c0 7 3 9 3 9H3s3-2 3-9" />
        <path d="M10.3 21a1.94 1.94 0 0 0 3.4 0" />
      </svg>
      <span
        aria-hidden="true"
        data-testid="notice-unread-count"
        className={cn("num absolute -right-2 -top-1.5 min-w-4 rounded-full bg-flare-soft px-1 text-center text-2xs font-semibold leading-4 text-flare-ink ring-1 ring-flare-ink", unread === 0 && "hidden")}
      >
        {unread > 99 ? "99+" : unread}
      </span>
    </Link>
  );
}
