import { expect, type Page } from "@playwright/test";

export const DEMO_PASSWORD = "nightbreak-demo";

export const DEMO = {
  pi: { email: "pi@nightbreak.test", section: "Your programs and override requests" },
  director: { email: "director@nightbreak.test", section: "Requests waiting for a decision" },
  observer: { email: "observer@nightbreak.test", section: "Your blocks in the next two weeks" },
  night_assistant: { email: "night@nightbreak.test", section: "Coming up on your telescopes" },
  admin: { email: "admin@nightbreak.test", section: "Consortium at a glance" },
} as const;

export type DemoRole = keyof typeof DEMO;

export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await expect(page).toHaveURL(/\/$/);
}
