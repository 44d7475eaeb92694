import { expect, test } from "@playwright/test";
import { DEMO, signIn } from "./helpers";

// An administrator's editor page, end to end: create, a refused duplicate (message beside
// the field, what was typed kept), edit, delete with a second confirmation, and a refusal
// to delete a partner that still has programs.
test("an admin creates, corrects, edits and deletes a partner on its editor page", async ({ page }) => {
  const code = `ZQ${Date.now().toString(36).slice(-5).toUpperCase()}`;
  await signIn(page, DEMO.admin.email);
  await page.goto("/admin/partners");

  const form = page.getByRole("form", { name: "Create a partner" });
  await form.getByLabel("Code").fill(code);
  await form.getByLabel("Name").fill("Invented partner for the editor test");
  await form.getByRole("button", { name: "Create partner" }).click();
  await expect(form.getByRole("status")).toContainText(`Partner ${code} created.`);
  const table = page.getByRole("table", { name: "Partners" });
  await expect(table.getByRole("row").filter({ hasText: code })).toContainText("Invented partner for the editor test");
  // A new record's form is emptied once saved.
  await expect(form.getByLabel("Code")).toHaveValue("");

  // The same code again: refused beside the field, the name typed is kept.
  await form.getByLabel("Code").fill(code);
  await form.getByLabel("Name").fill("A second partner with the same code");
  await form.getByRole("button", { name: "Create partner" }).click();
  await expect(form.getByLabel("Code")).toHaveAccessibleDescription(new RegExp(`A partner with the code ${code} already exists\\.`));
  await expect(form.getByLabel("Code")).toHaveAttribute("aria-invalid", "true");
  await expect(form.getByLabel("Name")).toHaveValue("A second partner with the same code");

  // Edit: the row's Edit link opens the form filled in.
  await table.getByRole("link", { name: `Edit partner ${code}` }).click();
  const edit = page.getByRole("form", { name: "Edit the partner" });
  await expect(edit.getByLabel("Code")).toHaveValue(code);
  await edit.getByLabel("Name").fill("Invented partner, renamed");
  await edit.getByRole("button", { name: "Save partner" }).click();
  await expect(table.getByRole("row").filter({ hasText: code })).toContainText("Invented partner, renamed");

  // Delete asks once more, in place.
  await table.getByRole("button", { name: `Delete partner ${code}` }).click();
  await table.getByRole("button", { name: `Confirm deleting partner ${code}` }).click();
  await expect(table.getByRole("row").filter({ hasText: code })).toHaveCount(0);

  // A partner with programs is not deleted, and says why beside its buttons.
  const busy = table.getByRole("row").filter({ has: page.getByRole("cell", { name: /^[1-9]\d*$/ }) }).first();
  const busyCode = (await busy.getByRole("cell").first().innerText()).trim();
  await busy.getByRole("button", { name: `Delete partner ${busyCode}` }).click();
  await busy.getByRole("button", { name: `Confirm deleting partner ${busyCode}` }).click();
  await expect(busy.getByRole("alert")).toContainText(`Partner ${busyCode} still has`);
  await expect(table.getByRole("row").filter({ hasText: busyCode })).toHaveCount(1);
});
