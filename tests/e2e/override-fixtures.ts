/**
 * Shared by the override journeys: find a scheduled block on AQ41 worth displacing and
 * file a ToO request (as the demo PI, through the API) for a target that transits in
 * its middle. Assumes the seeded demo: AQ41 at longitude −70.41° (America/Santiago),
 * the PI's ToO program TOO-01 and the LYRA instrument.
 */
import { expect, type Browser, type Page } from "@playwright/test";
import { DEMO, DEMO_PASSWORD, signIn } from "./helpers";

export const HOUR = 3_600_000;
const AQS_LONGITUDE = -70.41;

export interface CalendarBlock {
  id: string;
  kind: string;
  startsAt: string;
  endsAt: string;
  programCode: string;
  observerName: string | null;
}

/** Local sidereal time at the site in degrees (the GMST polynomial's first terms are ample here). */
export function siderealDegrees(t: number): number {
  const jd = t / 86_400_000 + 2440587.5;
  return (((280.46061837 + 360.98564736629 * (jd - 2451545.0) + AQS_LONGITUDE) % 360) + 360) % 360;
}

/** The local date at the southern site on which the night containing t began. */
export function nightOf(t: number): string {
  return new Intl.DateTimeFormat("en-CA", { timeZone: "America/Santiago", year: "numeric", month: "2-digit", day: "2-digit" }).format(new Date(t - 12 * HOUR));
}

export async function signedIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await signIn(page, email, DEMO_PASSWORD);
  return page;
}

/** A block on AQ41 starting 1.5–40 h from now, at least 2 h long, that matches `accept`. */
export async function findBlockOnAq41(page: Page, accept: (b: CalendarBlock) => boolean) {
  const { telescopes } = (await (await page.request.get("/api/v1/telescopes")).json()) as { telescopes: Array<{ id: string; code: string }> };
  const aq41 = telescopes.find((t) => t.code === "AQ41");
  expect(aq41, "the demo has AQ41").toBeTruthy();
  const from = new Date(Date.now() + 1.5 * HOUR).toISOString();
  const to = new Date(Date.now() + 40 * HOUR).toISOString();
  const { blocks } = (await (await page.request.get(`/api/v1/schedule?telescope=${aq41!.id}&from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`)).json()) as { blocks: CalendarBlock[] };
  const block = blocks.find((b) => accept(b) && Date.parse(b.startsAt) >= Date.parse(from) && Date.parse(b.endsAt) - Date.parse(b.startsAt) >= 2 * HOUR);
  expect(block, "a block of 2 h or more on AQ41 in the next 40 h").toBeTruthy();
  return { telescopeId: aq41!.id, block: block!, start: Date.parse(block!.startsAt), end: Date.parse(block!.endsAt) };
}

/** Files a one-hour request whose window is the block; returns the request id. */
export async function fileRequestForBlock(pi: Page, telescopeId: string, start: number, end: number, targetName: string): Promise<string> {
  await pi.goto("/requests/new");
  const programId = await pi.locator("#request-program option", { hasText: "TOO-01" }).getAttribute("value");
  const instrumentId = await pi.locator("#request-instrument option", { hasText: "AQ41 · LYRA" }).getAttribute("value");
  const filed = await pi.request.post("/api/v1/too-requests", {
    data: {
      programId,
      targetName,
      // Transits mid-block, near the zenith at latitude −30.5°.
      target: { kind: "fixed", ra: siderealDegrees((start + end) / 2), dec: -30 },
      telescopeIds: [telescopeId],
      instrumentId,
      durationMinutes: 60,
      earliestStart: new Date(start).toISOString(),
      latestEnd: new Date(end).toISOString(),
      deadline: new Date(end).toISOString(),
      urgency: "tonight",
      constraints: { darkness: "civil" },
      justification: "A fast-fading transient found an hour ago; colours tonight decide its nature.",
    },
  });
  expect(filed.status(), await filed.text()).toBe(201);
  return ((await filed.json()) as { request: { id: string } }).request.id;
}

export { DEMO };
