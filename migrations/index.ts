/**
 * Every migration, in order. Registered by hand (not read from the folder at run time)
 * so the same list works under tsx, Vitest and a bundled build. Add new ones at the end.
 */
import type { Migration } from "kysely";
import * as foundation from "./2026-12-01-0001-foundation";
import * as calendarFeeds from "./2026-12-01-0002-calendar-feeds";
import * as notifications from "./2026-12-01-0003-notifications";
import * as requests from "./2026-12-01-0004-requests";
import * as decisionsLedger from "./2026-12-01-0005-decisions-ledger";
import * as outcomeNotice from "./2026-12-01-0006-outcome-notice";
import * as requestLapse from "./2026-12-01-0007-request-lapse";
import * as semestersNoOverlap from "./2026-12-01-0008-semesters-no-overlap";
import * as requestReturned from "./2026-12-01-0009-request-returned";

export const migrations: Record<string, Migration> = {
  "2026-12-01-0001-foundation": foundation,
  "2026-12-01-0002-calendar-feeds": calendarFeeds,
  "2026-12-01-0003-notifications": notifications,
  "2026-12-01-0004-requests": requests,
  "2026-12-01-0005-decisions-ledger": decisionsLedger,
  "2026-12-01-0006-outcome-notice": outcomeNotice,
  "2026-12-01-0007-request-lapse": requestLapse,
  "2026-12-01-0008-semesters-no-overlap": semestersNoOverlap,
  "2026-12-01-0009-request-returned": requestReturned,
};
