import { expect, test } from "@playwright/test";
import { DEMO, signIn } from "./helpers";

test("an observer reads the calendar: blocks, twilight shading, UT and site time, block details", async ({ page }) => {
  await signIn(page, DEMO.observer.email);
  await page.getByRole("link", { name: "Schedule" }).click();
  await expect(page.getByRole("heading", { name: "Consortium schedule" })).toBeVisible();
  await expect(page.locator(".fc-event").first()).toBeVisible();
  expect(await page.locator(".twilight-astronomical").count()).toBeGreaterThan(0);
  // Observers cannot edit: no resize handles, no selection.
  await expect(page.locator(".fc-event-resizer")).toHaveCount(0);

  const firstSlotLabel = async () => (await page.locator(".fc-timegrid-slot-label-cushion").first().textContent())?.trim();
  expect(await firstSlotLabel()).toBe("12:00");
  await page.getByRole("button", { name: /Site time/ }).click();
  await expect(page.getByRole("button", { name: /Site time/ })).toHaveAttribute("aria-pressed", "true");

  await page.locator(".fc-event.block-kind-science").first().click();
  const panel = page.getByRole("region", { name: "Block details" });
  await expect(panel.getByText("PI", { exact: true })).toBeVisible();
  await expect(panel.getByText(/UT/).first()).toBeVisible();
  await expect(panel.getByRole("button", { name: "Remove block" })).toHaveCount(0);
});

test("an admin moves a block by dragging it, and a move onto another block is refused with a clear message", async ({ page }) => {
  await signIn(page, DEMO.admin.email);
  // A block in daytime, where nothing else is scheduled, to drag around.
  const telescopes = (await (await page.request.get("/api/v1/telescopes")).json()) as { telescopes: Array<{ id: string; code: string }> };
  const telescope = telescopes.telescopes.find((t) => t.code === "AQ16");
  expect(telescope).toBeTruthy();
  const program = "ENG-01";
  const day = new Date();
  day.setUTCHours(0, 0, 0, 0);
  const startsAt = new Date(day.getTime() + 14 * 3_600_000).toISOString();
  const endsAt = new Date(day.getTime() + 17 * 3_600_000).toISOString();
  // Clear the daytime window (a rerun against the same database leaves its block there).
  const existing = await page.request.get(`/api/v1/schedule?telescope=${telescope?.id}&from=${encodeURIComponent(startsAt)}&to=${encodeURIComponent(endsAt)}`);
  for (const block of ((await existing.json()) as { blocks: Array<{ id: string }> }).blocks) {
    expect((await page.request.delete(`/api/v1/blocks/${block.id}`)).status()).toBe(204);
  }
  await page.goto(`/schedule?telescope=AQ16`);
  await expect(page.locator(".fc-event").first()).toBeVisible();

  // Create it through the calendar: drag across empty daytime slots.
  const column = page.locator(`.fc-timegrid-col[data-date="${day.toISOString().slice(0, 10)}"]`);
  const slot14 = page.locator('.fc-timegrid-slot-lane[data-time="14:00:00"]');
  const slot1430 = page.locator('.fc-timegrid-slot-lane[data-time="14:30:00"]');
  await page.locator(".fc-scroller-liquid-absolute, .fc-scroller").last().evaluate((el) => (el.scrollTop = 0));
  const colBox = await column.boundingBox();
  const a = await slot14.boundingBox();
  const b = await slot1430.boundingBox();
  if (!colBox || !a || !b) throw new Error("calendar layout not found");
  const x = colBox.x + colBox.width / 2;
  await page.mouse.move(x, a.y + a.height / 2);
  await page.mouse.down();
  await page.mouse.move(x, b.y + b.height / 2, { steps: 8 });
  await page.mouse.up();
  const form = page.getByRole("form", { name: "New block" });
  await form.getByLabel("Program").selectOption({ label: `${program} — Instrument commissioning and focus runs` });
  await form.getByRole("button", { name: "Add block" }).click();
  await expect(page.getByText(`Added a block for ${program}.`)).toBeVisible();

  // Drag it one hour later.
  const created = page.locator(".fc-event.block-kind-engineering", { hasText: "14:00" }).first();
  await expect(created).toBeVisible();
  const box = await created.boundingBox();
  if (!box) throw new Error("new block not drawn");
  const hour = (b.y - a.y) * 2;
  await page.mouse.move(box.x + box.width / 2, box.y + 6);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width / 2, box.y + 6 + hour / 2, { steps: 6 });
  await page.mouse.move(box.x + box.width / 2, box.y + 6 + hour, { steps: 6 });
  await page.mouse.up();
  await expect(page.getByText(`Moved ${program}.`)).toBeVisible();
  await expect(page.locator(".fc-event.block-kind-engineering", { hasText: "15:00" }).first()).toBeVisible();

  // Another block right after it; dragging the first one onto it is refused, named, and put back.
  const programs = await page.request.get(`/api/v1/schedule?telescope=${telescope?.id}&from=${encodeURIComponent(startsAt)}&to=${encodeURIComponent(endsAt)}`);
  const mine = ((await programs.json()) as { blocks: Array<{ programId: string }> }).blocks[0];
  const blocker = await page.request.post("/api/v1/blocks", {
    data: { telescopeId: telescope?.id, programId: mine?.programId, kind: "discretionary", startsAt: new Date(day.getTime() + 16 * 3_600_000).toISOString(), endsAt: new Date(day.getTime() + 17 * 3_600_000).toISOString() },
  });
  expect(blocker.status()).toBe(201);
  await page.reload();
  const moved = page.locator(".fc-event.block-kind-engineering", { hasText: "15:00" }).first();
  await moved.scrollIntoViewIfNeeded();
  const movedBox = await moved.boundingBox();
  if (!movedBox) throw new Error("moved block not drawn");
  await page.mouse.move(movedBox.x + movedBox.width / 2, movedBox.y + 6);
  await page.mouse.down();
  await page.mouse.move(movedBox.x + movedBox.width / 2, movedBox.y + 6 + hour / 2, { steps: 6 });
  await page.mouse.move(movedBox.x + movedBox.width / 2, movedBox.y + 6 + hour, { steps: 6 });
  await page.mouse.up();
  await expect(page.getByRole("alert").filter({ hasText: /overlaps ENG-01 on Quebrada 1\.6 m, .* Nothing was saved\./ })).toBeVisible();
  await expect(page.locator(".fc-event.block-kind-engineering", { hasText: "15:00" }).first()).toBeVisible();
});
