/**
 * Every migration, in order. Registered by hand (not read from the folder at run time)
 * so the same list works under tsx, Vitest and a bundled build. Add new ones at the end.
 */
import type { Migration } from "kysely";
import * as foundation from "./2026-12-01-0001-foundation";
import * as calendarFeeds from "./2026-12-01-0002-calendar-feeds";

export const migrations: Record<string, Migration> = {
  "2026-12-01-0001-foundation": foundation,
  "2026-12-01-0002-calendar-feeds": calendarFeeds,
};
