/**
 * The authorization matrix for pages: every `page.tsx` under `app/` (read from disk) must
 * have a rule in tests/integration/trust/route-rules.ts. Each demo user opens every page
 * without dynamic segments: allowed roles get 200, the others the 403 page; signed out,
 * every desk page sends the browser to the sign-in page.
 */
import { readdirSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { expect, test } from "@playwright/test";
import { PAGE_RULES, type Rule } from "../integration/trust/route-rules";
import { DEMO, signIn, type DemoRole } from "./helpers";

const APP = fileURLToPath(new URL("../../app", import.meta.url));

const pageFiles = readdirSync(APP, { recursive: true, encoding: "utf8" })
  .filter((file) => path.basename(file) === "page.tsx")
  .map((file) => {
    const dir = path.dirname(file).split(path.sep).join("/");
    return dir === "." ? "" : dir;
  })
  .sort();

/** `(desk)/admin/users` → `/admin/users`; null when the path has a dynamic segment. */
function urlOf(page: string): string | null {
  if (/\[/.test(page)) return null;
  return "/" + page.split("/").filter((segment) => segment && !/^\(.*\)$/.test(segment)).join("/");
}

function allows(rule: Rule, role: DemoRole): boolean {
  return rule === "public" || rule.length === 0 || rule.includes(role);
}

const visitable = Object.entries(PAGE_RULES).flatMap(([page, rule]) => {
  const url = urlOf(page);
  return url === null ? [] : [{ page, url, rule }];
});

test("every page file has a rule, and every rule a page file", () => {
  expect(pageFiles.length).toBeGreaterThan(10);
  expect(pageFiles.filter((page) => !(page in PAGE_RULES)), "pages without a rule in route-rules.ts").toEqual([]);
  expect(Object.keys(PAGE_RULES).filter((page) => !pageFiles.includes(page)), "rules for pages that no longer exist").toEqual([]);
});

test("signed out, every desk page leads to the sign-in page", async ({ page }) => {
  for (const { url, rule } of visitable) {
    const response = await page.goto(url);
    if (rule === "public") {
      expect(response?.status(), url).toBe(200);
      continue;
    }
    await expect(page, url).toHaveURL(/\/sign-in(\?|$)/);
    expect(response?.status(), url).toBe(200);
  }
});

for (const role of Object.keys(DEMO) as DemoRole[]) {
  test(`the ${role} opens the pages their role allows and gets 403 on the others`, async ({ page }) => {
    test.setTimeout(120_000);
    await signIn(page, DEMO[role].email);
    for (const { url, rule } of visitable) {
      const response = await page.goto(url);
      if (allows(rule, role)) {
        expect(response?.status(), `${role} on ${url}`).toBe(200);
        await expect(page.getByRole("heading", { name: "This page needs a role you do not hold" }), `${role} on ${url}`).toHaveCount(0);
      } else {
        expect(response?.status(), `${role} on ${url}`).toBe(403);
        await expect(page.getByRole("heading", { name: "This page needs a role you do not hold" }), `${role} on ${url}`).toBeVisible();
      }
    }
  });
}
