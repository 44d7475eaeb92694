"use client";

import { mutate } from "swr";

/** The SWR key of the unread count, shared by the bell and whatever marks notices read. */
export const UNREAD_COUNT_KEY = "/api/v1/notices/unread-count";

export async function fetchUnreadCount(url: string): Promise<number> {
  const response = await fetch(url, { credentials: "same-origin", cache: "no-store" });
  if (!response.ok) throw new Error(`unread count: ${response.status}`);
  const body = (await response.json()) as { unread?: unknown };
  return typeof body.unread === "number" ? body.unread : 0;
}

export function refreshUnreadCount(): void {
  void mutate(UNREAD_COUNT_KEY);
}
