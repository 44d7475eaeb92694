import { expect, test } from "@playwright/test";
import { DEMO, signIn, type DemoRole } from "./helpers";

for (const role of Object.keys(DEMO) as DemoRole[]) {
  test(`the ${role} demo user signs in and sees their home`, async ({ page }) => {
    await signIn(page, DEMO[role].email);
    await expect(page.getByRole("heading", { name: DEMO[role].section })).toBeVisible();
    // Sections of other roles are not shown.
    for (const other of Object.keys(DEMO) as DemoRole[]) {
      if (other !== role) await expect(page.getByRole("heading", { name: DEMO[other].section })).toHaveCount(0);
    }
    await page.getByRole("button", { name: "Sign out" }).click();
    await expect(page).toHaveURL(/\/sign-in/);
  });
}

test("a wrong password is refused with a clear message and the e-mail stays filled in", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(DEMO.pi.email);
  await page.getByLabel("Password").fill("not the password");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByRole("alert").filter({ hasText: "do not match an active account" })).toBeVisible();
  await expect(page.getByLabel("E-mail")).toHaveValue(DEMO.pi.email);
  await expect(page).toHaveURL(/\/sign-in/);
});

test("empty and malformed fields get messages beside them", async ({ page }) => {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill("not-an-address");
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page.getByText("Enter the e-mail address you were registered with.")).toBeVisible();
  await expect(page.getByText("Enter your password.")).toBeVisible();
});

test("a signed-out visitor is sent to the sign-in page", async ({ page }) => {
  await page.goto("/");
  await expect(page).toHaveURL(/\/sign-in/);
  await page.goto("/admin/users");
  await expect(page).toHaveURL(/\/sign-in/);
});
