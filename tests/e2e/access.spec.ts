import { expect, test } from "@playwright/test";
import { DEMO, signIn, type DemoRole } from "./helpers";

const NOT_ADMIN: DemoRole[] = ["pi", "director", "observer", "night_assistant"];

for (const role of NOT_ADMIN) {
  test(`the ${role} is refused on the admin pages and the admin route`, async ({ page }) => {
    await signIn(page, DEMO[role].email);
    const pageResponse = await page.goto("/admin/users");
    expect(pageResponse?.status()).toBe(403);
    await expect(page.getByRole("heading", { name: "This page needs a role you do not hold" })).toBeVisible();
    await expect(page.getByRole("link", { name: "Admin" })).toHaveCount(0);
    const api = await page.request.get("/api/v1/admin/users");
    expect(api.status()).toBe(403);
  });
}

test("the route handler answers 401 to a request without a session", async ({ request }) => {
  const response = await request.get("/api/v1/admin/users");
  expect(response.status()).toBe(401);
});

test("an admin creates a user: bad input is explained, good input is saved, and the new user can sign in", async ({ page, browser }) => {
  await signIn(page, DEMO.admin.email);
  await page.getByRole("link", { name: "Admin" }).click();
  await page.getByRole("link", { name: /Users and roles/ }).click();
  const form = page.getByRole("form", { name: "Create a user" });

  await form.getByLabel("Name").fill("Vera Stellmach");
  await form.getByLabel("E-mail").fill("vera");
  await form.getByLabel("First password").fill("short");
  await form.getByRole("button", { name: "Create user" }).click();
  await expect(form.getByText("Enter a valid e-mail address.")).toBeVisible();
  await expect(form.getByText("Use at least 12 characters.")).toBeVisible();
  await expect(form.getByText("Give the user at least one role.")).toBeVisible();
  await expect(form.getByLabel("Name")).toHaveValue("Vera Stellmach");

  const email = `vera.${Date.now()}@nightbreak.test`;
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("First password").fill("a perfectly long password");
  await form.getByLabel("Observer").check();
  await form.getByRole("button", { name: "Create user" }).click();
  await expect(form.getByText(`can now sign in as ${email}`)).toBeVisible();
  await expect(page.getByRole("cell", { name: email })).toBeVisible();

  // The same e-mail twice is refused without losing what was typed.
  await form.getByLabel("Name").fill("Vera Again");
  await form.getByLabel("E-mail").fill(email);
  await form.getByLabel("First password").fill("a perfectly long password");
  await form.getByLabel("Observer").check();
  await form.getByRole("button", { name: "Create user" }).click();
  await expect(form.getByText("already exists")).toBeVisible();
  await expect(form.getByLabel("Name")).toHaveValue("Vera Again");

  const other = await browser.newContext();
  const newPage = await other.newPage();
  await signIn(newPage, email, "a perfectly long password");
  await expect(newPage.getByRole("heading", { name: DEMO.observer.section })).toBeVisible();
  await other.close();
});
