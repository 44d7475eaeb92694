/**
 * The director's decision end to end. The PI files a request through the API for a
 * target that transits in the middle of a scheduled science block on AQ41 (the request's
 * window is that block, so every suggestion displaces that block's observer); the
 * director opens it from the review queue, takes the second suggestion, approves; then
 * the calendar, the displaced observer's notices, the night assistant's queue and the
 * ledger all show the override.
 *
 * Assumes the seeded demo (db/seed.ts): AQ41 at Alto Quebrada (longitude −70.41°,
 * America/Santiago), the PI's ToO program TOO-01, the LYRA instrument, night@ assisting
 * on AQ41, every demo person with the demo password, and nights fully booked.
 */
import { expect, test, type Browser, type Page } from "@playwright/test";
import { DEMO, DEMO_PASSWORD, signIn } from "./helpers";

const HOUR = 3_600_000;
const AQS_LONGITUDE = -70.41;

interface CalendarBlock {
  id: string;
  kind: string;
  startsAt: string;
  endsAt: string;
  programCode: string;
  observerName: string | null;
}

/** Local sidereal time at the site in degrees (the GMST polynomial's first terms are ample here). */
function siderealDegrees(t: number): number {
  const jd = t / 86_400_000 + 2440587.5;
  return (((280.46061837 + 360.98564736629 * (jd - 2451545.0) + AQS_LONGITUDE) % 360) + 360) % 360;
}

function nightOf(t: number): string {
  return new Intl.DateTimeFormat("en-CA", { timeZone: "America/Santiago", year: "numeric", month: "2-digit", day: "2-digit" }).format(new Date(t - 12 * HOUR));
}

async function signedIn(browser: Browser, email: string): Promise<Page> {
  const page = await (await browser.newContext()).newPage();
  await signIn(page, email, DEMO_PASSWORD);
  return page;
}

test("the director takes the second suggestion and approves; calendar, notices, tonight's queue and the ledger show it", async ({ browser }) => {
  test.setTimeout(180_000);
  const targetName = `E2E transient ${Date.now().toString(36)}`;

  // The PI: a science block with an observer on AQ41, starting 1.5–40 h from now, at least 2 h long.
  const pi = await signedIn(browser, DEMO.pi.email);
  const { telescopes } = (await (await pi.request.get("/api/v1/telescopes")).json()) as { telescopes: Array<{ id: string; code: string }> };
  const aq41 = telescopes.find((t) => t.code === "AQ41");
  expect(aq41, "the demo has AQ41").toBeTruthy();
  const now = Date.now();
  const from = new Date(now + 1.5 * HOUR).toISOString();
  const to = new Date(now + 40 * HOUR).toISOString();
  const schedule = (await (await pi.request.get(`/api/v1/schedule?telescope=${aq41!.id}&from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`)).json()) as { blocks: CalendarBlock[] };
  const block = schedule.blocks.find((b) => b.kind === "science" && b.observerName && Date.parse(b.startsAt) >= Date.parse(from) && Date.parse(b.endsAt) - Date.parse(b.startsAt) >= 2 * HOUR);
  expect(block, "a science block of 2 h or more with an observer on AQ41 in the next 40 h").toBeTruthy();
  const blockStart = Date.parse(block!.startsAt);
  const blockEnd = Date.parse(block!.endsAt);

  await pi.goto("/requests/new");
  const programId = await pi.locator("#request-program option", { hasText: "TOO-01" }).getAttribute("value");
  const instrumentId = await pi.locator("#request-instrument option", { hasText: "AQ41 · LYRA" }).getAttribute("value");
  const filed = await pi.request.post("/api/v1/too-requests", {
    data: {
      programId,
      targetName,
      // Transits mid-block, near the zenith at latitude −30.5°.
      target: { kind: "fixed", ra: siderealDegrees((blockStart + blockEnd) / 2), dec: -30 },
      telescopeIds: [aq41!.id],
      instrumentId,
      durationMinutes: 60,
      earliestStart: new Date(blockStart).toISOString(),
      latestEnd: new Date(blockEnd).toISOString(),
      deadline: new Date(blockEnd).toISOString(),
      urgency: "tonight",
      constraints: { darkness: "civil" },
      justification: "A fast-fading transient found an hour ago; colours tonight decide its nature.",
    },
  });
  expect(filed.status(), await filed.text()).toBe(201);

  // The director: queue → request → second suggestion → live impact → approve.
  const director = await signedIn(browser, DEMO.director.email);
  await director.getByRole("link", { name: "Review", exact: true }).click();
  await expect(director.getByRole("heading", { name: "Review queue" })).toBeVisible({ timeout: 30_000 });
  await director.getByRole("link", { name: targetName }).click();
  await expect(director.getByRole("heading", { name: targetName, exact: true })).toBeVisible({ timeout: 60_000 });
  const suggestions = director.getByRole("list", { name: "Suggested slots" });
  await expect(suggestions.getByRole("listitem")).not.toHaveCount(0);
  const second = suggestions.getByRole("button", { name: "Use suggestion 2" });
  await second.click();
  await expect(second).toHaveAttribute("aria-pressed", "true");
  const start = await director.getByLabel("Slot start (UT)").inputValue();
  const end = await director.getByLabel("Slot end (UT)").inputValue();
  await expect(director.getByTestId("impact-summary")).toContainText(`Displaces 1 h 00 min`);
  const impact = (await (await director.request.get(`/api/v1/impact?telescope=AQ41&start=${start}:00Z&end=${end}:00Z`)).json()) as {
    impact: { blocks: Array<{ programCode: string; observerEmail: string | null }> };
  };
  const displaced = impact.impact.blocks[0];
  expect(displaced?.programCode).toBe(block!.programCode);
  expect(displaced?.observerEmail).toBeTruthy();
  await director.getByRole("button", { name: "Approve this slot" }).click();
  await expect(director.getByRole("heading", { name: "Approved", exact: true })).toBeVisible({ timeout: 30_000 });

  // The calendar: the override block is there, in the flare.
  const slot = (await (await director.request.get(`/api/v1/schedule?telescope=${aq41!.id}&from=${start}:00Z&to=${end}:00Z`)).json()) as { blocks: CalendarBlock[] };
  expect(slot.blocks.map((b) => [b.kind, b.startsAt.slice(0, 16), b.endsAt.slice(0, 16)])).toEqual([["too", start, end]]);
  await director.goto("/schedule?telescope=AQ41");
  await expect(director.locator(".fc-event.block-kind-too", { hasText: "TOO-01" }).first()).toBeVisible();

  // The displaced observer's notices.
  const observer = await signedIn(browser, displaced!.observerEmail!);
  await observer.goto("/notices");
  await expect(observer.getByText(new RegExp(`Your ${block!.programCode} block on AQ41 was`)).first()).toBeVisible();
  await expect(observer.getByText(new RegExp(`override for ${targetName}`)).first()).toBeVisible();

  // The night assistant's queue for that night.
  const night = await signedIn(browser, DEMO.night_assistant.email);
  await night.goto(`/tonight/AQ41?night=${nightOf(Date.parse(`${start}:00Z`))}`);
  await expect(night.getByText(targetName).first()).toBeVisible();

  // The ledger: the displaced program is owed, the ToO program charged.
  await director.goto("/ledger");
  const table = director.getByRole("table", { name: "Time owed per program" });
  await director.getByLabel("Filter programs").fill(block!.programCode);
  await expect(table.getByRole("row", { name: new RegExp(block!.programCode) })).toBeVisible();
  await director.getByLabel("Filter programs").fill("TOO-01");
  await expect(table.getByRole("row", { name: /TOO-01/ })).toBeVisible();
});
