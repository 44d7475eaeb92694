import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { DEMO, signIn, type DemoRole } from "./helpers";

async function seriousViolations(page: Page) {
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  return results.violations
    .filter((v) => v.impact === "serious" || v.impact === "critical")
    .map((v) => `${v.id}: ${v.help} (${v.nodes.map((n) => n.target.join(" ")).join(", ")})`);
}

test("the sign-in page has no serious accessibility violations", async ({ page }) => {
  await page.goto("/sign-in");
  expect(await seriousViolations(page)).toEqual([]);
});

for (const role of Object.keys(DEMO) as DemoRole[]) {
  test(`the ${role} home has no serious accessibility violations, in the day and night themes`, async ({ page }) => {
    await signIn(page, DEMO[role].email);
    await expect(page.getByRole("heading", { name: DEMO[role].section })).toBeVisible();
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole("button", { name: /Switch to the night theme/ }).click();
    await expect(page.locator("html")).toHaveAttribute("data-theme", "night");
    expect(await seriousViolations(page)).toEqual([]);
    await page.getByRole("button", { name: /Switch to the day theme/ }).click();
  });
}
