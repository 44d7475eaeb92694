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
import { expect, test } from "@playwright/test";
import { DEMO } from "./helpers";
import { fileRequestForBlock, findBlockOnAq41, nightOf, signedIn, type CalendarBlock } from "./override-fixtures";

test("the director takes the second suggestion and approves; calendar, notices, tonight's queue and the ledger show it", async ({ browser }) => {
  test.setTimeout(180_000);
  const targetName = `E2E transient ${Date.now().toString(36)}`;

  // The PI: a science block with an observer on AQ41, starting 1.5–40 h from now, at least 2 h long.
  const pi = await signedIn(browser, DEMO.pi.email);
  const { telescopeId, block, start: blockStart, end: blockEnd } = await findBlockOnAq41(pi, (b) => b.kind === "science" && !!b.observerName);
  const aq41 = { id: telescopeId };
  await fileRequestForBlock(pi, telescopeId, blockStart, blockEnd, targetName);

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
  expect(displaced?.programCode).toBe(block.programCode);
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
  await expect(observer.getByText(new RegExp(`Your ${block.programCode} block on AQ41 was`)).first()).toBeVisible();
  await expect(observer.getByText(new RegExp(`override for ${targetName}`)).first()).toBeVisible();

  // The night assistant's queue for that night.
  const night = await signedIn(browser, DEMO.night_assistant.email);
  await night.goto(`/tonight/AQ41?night=${nightOf(Date.parse(`${start}:00Z`))}`);
  await expect(night.getByText(targetName).first()).toBeVisible();

  // The ledger: the displaced program is owed, the ToO program charged.
  await director.goto("/ledger");
  const table = director.getByRole("table", { name: "Time owed per program" });
  await director.getByLabel("Filter programs").fill(block.programCode);
  await expect(table.getByRole("row", { name: new RegExp(block.programCode) })).toBeVisible();
  await director.getByLabel("Filter programs").fill("TOO-01");
  await expect(table.getByRole("row", { name: /TOO-01/ })).toBeVisible();
});
