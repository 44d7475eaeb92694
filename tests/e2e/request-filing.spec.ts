import { expect, test } from "@playwright/test";
import { formatDec, formatRa } from "../../lib/sky/coordinates";
import { sunPosition } from "../../lib/sky/sun";
import { DEMO, signIn } from "./helpers";

// A 1×1 PNG, enough for the content check (it looks at the signature bytes).
const FINDING_CHART = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==", "base64");
const HOUR = 3_600_000;

/**
 * An invented fast-moving object for tonight, placed opposite the Sun at the southern
 * site's zenith declination so it is observable whatever the date of the run: hourly rows
 * from six hours ago to four days ahead, in sexagesimal, with r and Δ for the fading clock.
 */
function ephemerisCsv(now: Date, raDeg: number): string {
  const lines = ["utc,ra,dec,r_au,delta_au"];
  for (let i = -6; i <= 96; i++) {
    const t = new Date(Math.floor(now.getTime() / HOUR) * HOUR + i * HOUR);
    lines.push(`${t.toISOString()},${formatRa((raDeg + 0.04 * i + 360) % 360)},${formatDec(-30 + 0.01 * i)},${(1.1 + 0.002 * i).toFixed(4)},${(0.25 + 0.003 * i).toFixed(4)}`);
  }
  return `${lines.join("\n")}\n`;
}

test("a PI files a ToO request: typed coordinates, finding chart, ephemeris, live feasibility, then finds it in the list", async ({ page }) => {
  test.setTimeout(150_000);
  const now = new Date();
  const antiSolarRa = (sunPosition(now.getTime()).raDeg + 180) % 360;
  const targetName = `Invented comet C/NB-${now.getTime().toString(36).toUpperCase()}`;

  await signIn(page, DEMO.pi.email);
  await page.getByRole("link", { name: "Requests", exact: true }).click();
  await page.getByRole("link", { name: "New request" }).click();
  await expect(page.getByRole("heading", { name: "New ToO request" })).toBeVisible();

  const form = page.getByRole("form", { name: "ToO request" });
  await form.getByLabel("Program", { exact: true }).selectOption({ label: "TOO-01 — Rapid photometry of fast-moving small bodies" });
  await form.getByLabel("Target name", { exact: true }).fill(targetName);
  // Sexagesimal, typed the way an astronomer would.
  await form.getByLabel("Right ascension (J2000)").fill(formatRa(antiSolarRa, { style: "spaces", decimals: 1 }));
  await form.getByLabel("Declination (J2000)").fill("-30 00 00");
  await form.getByLabel("AQ16 — Quebrada 1.6 m", { exact: true }).check();
  await form.getByLabel("Instrument", { exact: true }).selectOption({ label: "AQ16 · PICO — Pico fast-readout camera (limit V 21.9)" });
  await form.getByLabel("Maximum airmass").fill("2.5");
  await form.getByLabel("Scientific justification").fill("A bright, fast-fading comet on an unusual orbit: colours and a light curve are needed before it fades below reach.");

  // The draft saves as the PI types, and the address becomes the draft's.
  await expect(page.getByText(/^Draft saved at \d\d:\d\d UT$/)).toBeVisible({ timeout: 20_000 });
  await expect(page).toHaveURL(/\/requests\/[0-9a-f-]{36}$/);

  // Live feasibility: the airmass chart for AQ16 and the night-by-night windows.
  const feasibility = page.getByRole("region", { name: "Feasibility", exact: true });
  await expect(feasibility.getByText(/Planning aid only/).first()).toBeVisible();
  await expect(feasibility.getByRole("img", { name: /^Airmass of Invented comet .* from AQ16 on the night of \d{4}-\d\d-\d\d/ })).toBeVisible({ timeout: 30_000 });
  const nights = feasibility.getByRole("table", { name: "Observable windows on AQ16, night by night" });
  await expect(nights.locator("time").first()).toBeVisible();
  await expect(feasibility.getByText(/^Feasible: First window long enough on AQ16/)).toBeVisible();

  // A finding chart, through the upload service.
  await form.getByLabel("Attachment kind").selectOption({ label: "Finding chart" });
  await form.getByLabel("Attach a file").setInputFiles({ name: "finding-chart.png", mimeType: "image/png", buffer: FINDING_CHART });
  const attached = form.getByRole("list", { name: "Attached files" });
  await expect(attached.getByRole("listitem").filter({ hasText: "finding-chart.png" })).toContainText("Finding chart", { timeout: 30_000 });

  // Then the moving target's ephemeris: the preview follows it, with the fading clock.
  await form.getByLabel("Moving target (ephemeris)").check();
  await form.getByLabel("Ephemeris table (CSV)").setInputFiles({ name: "nb-comet-ephemeris.csv", mimeType: "text/csv", buffer: Buffer.from(ephemerisCsv(now, antiSolarRa)) });
  await expect(form.getByText(/^103 rows, .* UT, with r and Δ$/)).toBeVisible();
  await form.getByLabel("Absolute magnitude H").fill("19");
  await expect(attached.getByRole("listitem").filter({ hasText: "nb-comet-ephemeris.csv" })).toContainText("Ephemeris table", { timeout: 30_000 });
  await expect(feasibility.getByRole("heading", { name: "Fading clock" })).toBeVisible({ timeout: 30_000 });
  await expect(feasibility.getByRole("img", { name: /^Airmass of Invented comet .* from AQ16/ })).toBeVisible();
  await expect(feasibility.getByText(/^Feasible: First window long enough on AQ16/)).toBeVisible();

  // File it: the request opens read-only, with its history.
  await form.getByRole("button", { name: "Submit request" }).click();
  await expect(page.getByRole("button", { name: "Withdraw request" })).toBeVisible({ timeout: 30_000 });
  await expect(page.getByRole("heading", { name: targetName })).toBeVisible();
  const history = page.getByRole("list", { name: "State history" });
  await expect(history).toContainText("Draft → Submitted");
  await expect(page.getByRole("list", { name: "Attached files" })).toContainText("finding-chart.png");

  // And it is in the PI's list.
  await page.getByRole("link", { name: "Requests", exact: true }).click();
  const row = page.getByRole("table", { name: "Your requests" }).getByRole("row").filter({ hasText: targetName });
  await expect(row).toContainText("Submitted");
  await expect(row).toContainText("TOO-01");
  await expect(row).toContainText("AQ16");
});
