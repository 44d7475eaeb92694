import { expect, test } from "@playwright/test";
import { DEMO, signIn } from "./helpers";

// Daytime hours a week from now on the southern 4.1 m: nothing else is scheduled then.
const day = new Date();
day.setUTCHours(0, 0, 0, 0);
const week = new Date(day.getTime() + 7 * 86_400_000);
const at = (hour: number) => new Date(week.getTime() + hour * 3_600_000).toISOString().replace(".000", "");

function csv(rows: string[]): Buffer {
  return Buffer.from(["telescope,program,observer_email,instrument,kind,start,end,time_zone,notes", ...rows].join("\n"));
}

test("an admin checks and imports a small semester, sees it on the calendar, and the observer subscribes to their feed", async ({ page, browser }) => {
  await signIn(page, DEMO.admin.email);
  await page.goto("/admin/schedule-import");

  // A file with a bad row is reported by line and nothing can be imported.
  await page.getByLabel("Schedule file", { exact: true }).setInputFiles({
    name: "semester.csv",
    mimeType: "text/csv",
    buffer: csv([`AQ41,SCI-101,observer@nightbreak.test,LYRA,science,${at(13)},${at(14)},,`, `AQ41,NOPE-9,,,science,${at(14)},${at(15)},,`]),
  });
  await page.getByRole("button", { name: "Check file" }).click();
  const problems = page.getByRole("table", { name: "Problems in the file" });
  await expect(problems).toContainText("3");
  await expect(problems).toContainText(/NOPE-9/);
  await expect(page.getByRole("button", { name: /^Import \d+ blocks?$/ })).toBeDisabled();

  // The corrected file imports all at once.
  await page.getByLabel("Schedule file", { exact: true }).setInputFiles({
    name: "semester.csv",
    mimeType: "text/csv",
    buffer: csv([
      `AQ41,SCI-101,observer@nightbreak.test,LYRA,science,${at(13)},${at(14)},,first`,
      `AQ41,SCI-105,observer@nightbreak.test,,science,${at(14)},${at(15)},,second`,
      `AQ41,DDT-01,,,discretionary,${at(15)},${at(16)},,third`,
    ]),
  });
  await page.getByRole("button", { name: "Check file" }).click();
  await page.getByRole("button", { name: "Import 3 blocks" }).click();
  await expect(page.getByText(/imported|created/i).first()).toBeVisible();

  await page.goto("/schedule?telescope=AQ41");
  await page.getByRole("button", { name: "Next" }).or(page.locator(".fc-next-button")).first().click();
  await page.locator(".fc-scroller-liquid-absolute, .fc-scroller").last().evaluate((el) => (el.scrollTop = 0));
  const column = page.locator(`.fc-timegrid-col[data-date="${week.toISOString().slice(0, 10)}"]`);
  await expect(column.locator(".fc-event", { hasText: /13:00.*SCI-101/ })).toBeVisible();
  await expect(column.locator(".fc-event", { hasText: /15:00.*DDT-01/ })).toBeVisible();

  // The observer creates a feed of their own blocks; the secret URL serves an iCalendar with the new block.
  const context = await browser.newContext();
  const observer = await context.newPage();
  await signIn(observer, DEMO.observer.email);
  await observer.goto("/feeds");
  await observer.getByRole("button", { name: "Create feed" }).click();
  const url = await observer.getByLabel("Feed URL").inputValue();
  expect(url).toMatch(/\/feeds\/nbf_/);
  const anonymous = await browser.newContext();
  const feed = await anonymous.request.get(url);
  expect(feed.status()).toBe(200);
  expect(feed.headers()["content-type"]).toContain("text/calendar");
  const body = await feed.text();
  expect(body).toContain("BEGIN:VCALENDAR");
  expect(body).toContain(`DTSTART:${at(13).replace(/[-:]/g, "")}`);
  await anonymous.close();
  await context.close();
});
