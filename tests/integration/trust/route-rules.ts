/**
 * Who may call each route handler, by path under `app/` and HTTP method. The matrix test
 * (route-matrix.test.ts) reads the app folder at test time, so a new `route.ts` or a new
 * exported method without a line here fails it.
 *
 * `"public"`: no credential needed. `[]`: any signed-in user. Otherwise the roles allowed.
 */
import type { Role } from "@/db/types";

export type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE" | "HEAD" | "OPTIONS";
export type Rule = "public" | Role[];

export const ROUTE_RULES: Record<string, Partial<Record<Method, Rule>>> = {
  "api/health": { GET: "public" },
  "api/v1/openapi.json": { GET: "public" },
  "feeds/[token]": { GET: "public" },

  "api/v1/admin/users": { GET: ["admin"], POST: ["admin"] },
  "api/v1/blocks": { POST: ["admin"] },
  "api/v1/blocks/[id]": { GET: [], PATCH: ["admin"], DELETE: ["admin"] },
  "api/v1/blocks/[id]/executions": { POST: ["night_assistant", "admin"] },
  "api/v1/impact": { GET: ["director", "admin"] },
  "api/v1/ledger": { GET: ["director", "admin", "pi", "observer"] },
  "api/v1/notices": { GET: [] },
  "api/v1/notices/[id]/read": { POST: [] },
  "api/v1/notices/preferences": { GET: [], PUT: [] },
  "api/v1/notices/read-all": { POST: [] },
  "api/v1/notices/unread-count": { GET: [] },
  "api/v1/schedule": { GET: [] },
  "api/v1/schedule/export": { GET: [] },
  "api/v1/telescopes": { GET: [] },
  "api/v1/telescopes/[id]/acknowledgements": { POST: ["night_assistant", "admin"] },
  "api/v1/telescopes/[id]/queue": { GET: ["night_assistant", "director", "observer", "admin"] },
  "api/v1/too-requests": { POST: ["pi"] },
  "api/v1/too-requests/[id]": { GET: ["pi", "director"] },
  "api/v1/too-requests/[id]/decision": { POST: ["director"] },
  "api/v1/too-requests/[id]/withdraw": { POST: ["pi"] },
  "api/v1/too-requests/feasibility": { POST: [] },
  "api/v1/visibility": { POST: [] },
};

/** Route files the matrix does not call directly, and why. */
export const ROUTE_EXCLUSIONS: Record<string, string> = {
  "api/auth/[...nextauth]":
    "next-auth's own handler: sign-in and session endpoints are public by nature; the sign-in rate limit and credential checks are tested in sign-in.test.ts",
  "api/uploadthing":
    "UploadThing's handler: the file router's middleware checks the session (lib/attachments/app-router.ts), and the upload service signs its callbacks",
};

/**
 * Who may open each page, by path of its `page.tsx` under `app/`. Checked in the browser
 * by tests/e2e/page-matrix.spec.ts; pages with dynamic segments are only listed.
 */
export const PAGE_RULES: Record<string, Rule> = {
  "(auth)/sign-in": "public",
  "(desk)": [],
  "(desk)/admin": ["admin"],
  "(desk)/admin/instruments": ["admin"],
  "(desk)/admin/outbox": ["admin"],
  "(desk)/admin/partners": ["admin"],
  "(desk)/admin/programs": ["admin"],
  "(desk)/admin/schedule-import": ["admin"],
  "(desk)/admin/semesters": ["admin"],
  "(desk)/admin/sites": ["admin"],
  "(desk)/admin/telescopes": ["admin"],
  "(desk)/admin/users": ["admin"],
  "(desk)/feeds": [],
  "(desk)/ledger": ["director", "admin", "pi", "observer"],
  "(desk)/notices": [],
  "(desk)/requests": ["pi"],
  "(desk)/requests/[id]": ["pi", "director"],
  "(desk)/requests/new": ["pi"],
  "(desk)/review": ["director"],
  "(desk)/review/[id]": ["director"],
  "(desk)/schedule": [],
  "(desk)/settings": [],
  "(desk)/settings/tokens": [],
  "(desk)/tonight": ["night_assistant", "director", "observer", "admin"],
  "(desk)/tonight/[telescope]": ["night_assistant", "director", "observer", "admin"],
};
