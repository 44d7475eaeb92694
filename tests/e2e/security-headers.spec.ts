/**
 * The security headers on every answer, and the Content-Security-Policy in practice: the
 * pages with the most third-party code (the sign-in form, FullCalendar on /schedule, the
 * airmass chart and the upload service on /requests/new) render without one violation.
 */
import { expect, test, type Page } from "@playwright/test";
import { sunPosition } from "../../lib/sky/sun";
import { formatRa } from "../../lib/sky/coordinates";
import { DEMO, signIn } from "./helpers";

const FINDING_CHART = Buffer.from("iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==", "base64");

for (const path of ["/", "/sign-in"]) {
  test(`${path} carries the security headers`, async ({ request }) => {
    const response = await request.get(path, { maxRedirects: 0 });
    const headers = response.headers();
    const csp = headers["content-security-policy"] ?? "";
    for (const directive of [
      "default-src 'self'",
      "script-src 'self' 'unsafe-inline'",
      "style-src 'self' 'unsafe-inline'",
      "frame-ancestors 'none'",
      "object-src 'none'",
      "base-uri 'self'",
      "form-action 'self'",
    ]) {
      expect(csp, path).toContain(directive);
    }
    expect(csp).not.toContain("'unsafe-eval'");
    expect(headers["x-content-type-options"]).toBe("nosniff");
    expect(headers["x-frame-options"]).toBe("DENY");
    expect(headers["referrer-policy"]).toBe("strict-origin-when-cross-origin");
    expect(headers["permissions-policy"]).toContain("camera=()");
    // The tests run on loopback http: HSTS there would pin a developer's browser to https.
    expect(headers["strict-transport-security"]).toBeUndefined();
    expect(headers["x-powered-by"]).toBeUndefined();
  });
}

/** Collects CSP violations from the console and from the page's own violation events. */
function watchCsp(page: Page): () => Promise<string[]> {
  const found: string[] = [];
  page.on("console", (message) => {
    if (message.text().includes("Content Security Policy")) found.push(`console ${message.type()}: ${message.text()}`);
  });
  void page.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { __cspViolations: string[] }).__cspViolations = seen;
    document.addEventListener("securitypolicyviolation", (e) => seen.push(`${e.violatedDirective} blocked ${e.blockedURI || "inline"} (${e.sourceFile}:${e.lineNumber})`));
  });
  return async () => {
    const events = await page.evaluate(() => (window as unknown as { __cspViolations?: string[] }).__cspViolations ?? []).catch(() => []);
    return [...found, ...events];
  };
}

test("the sign-in page renders and signs in without a CSP violation", async ({ page }) => {
  const violations = watchCsp(page);
  await page.goto("/sign-in");
  await expect(page.getByRole("button", { name: "Sign in" })).toBeVisible();
  await signIn(page, DEMO.director.email);
  await expect(page.getByRole("heading", { name: DEMO.director.section })).toBeVisible();
  expect(await violations()).toEqual([]);
});

test("the schedule (FullCalendar) renders without a CSP violation", async ({ page }) => {
  const violations = watchCsp(page);
  await signIn(page, DEMO.admin.email);
  await page.goto("/schedule");
  await expect(page.getByRole("heading", { name: "Consortium schedule" })).toBeVisible();
  await expect(page.locator(".fc-event").first()).toBeVisible();
  await page.locator(".fc-event.block-kind-science").first().click();
  await expect(page.getByRole("region", { name: "Block details" }).getByText("PI", { exact: true })).toBeVisible();
  expect(await violations()).toEqual([]);
});

test("a new request (airmass chart, upload to the upload service) works without a CSP violation", async ({ page }) => {
  test.setTimeout(120_000);
  const violations = watchCsp(page);
  const antiSolarRa = (sunPosition(Date.now()).raDeg + 180) % 360;
  await signIn(page, DEMO.pi.email);
  await page.goto("/requests/new");
  const form = page.getByRole("form", { name: "ToO request" });
  await form.getByLabel("Program", { exact: true }).selectOption({ label: "TOO-01 — Rapid photometry of fast-moving small bodies" });
  await form.getByLabel("Target name", { exact: true }).fill(`CSP check ${Date.now().toString(36)}`);
  await form.getByLabel("Right ascension (J2000)").fill(formatRa(antiSolarRa, { style: "spaces", decimals: 1 }));
  await form.getByLabel("Declination (J2000)").fill("-30 00 00");
  await form.getByLabel("AQ16 — Quebrada 1.6 m", { exact: true }).check();
  await form.getByLabel("Instrument", { exact: true }).selectOption({ label: "AQ16 · PICO — Pico fast-readout camera (limit V 21.9)" });
  await form.getByLabel("Scientific justification").fill("Checking that the page works under the content security policy.");
  await expect(page).toHaveURL(/\/requests\/[0-9a-f-]{36}$/, { timeout: 20_000 });

  const feasibility = page.getByRole("region", { name: "Feasibility", exact: true });
  await expect(feasibility.getByRole("img", { name: /^Airmass of CSP check .* from AQ16/ })).toBeVisible({ timeout: 30_000 });

  await form.getByLabel("Attachment kind").selectOption({ label: "Finding chart" });
  await form.getByLabel("Attach a file").setInputFiles({ name: "csp-chart.png", mimeType: "image/png", buffer: FINDING_CHART });
  await expect(form.getByRole("list", { name: "Attached files" }).getByRole("listitem").filter({ hasText: "csp-chart.png" })).toContainText("Finding chart", { timeout: 30_000 });
  expect(await violations()).toEqual([]);
});
