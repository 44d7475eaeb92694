/**
 * Two people at once: the night assistant has tonight's queue open while the director
 * approves an override through the API. The open page shows the change within 10 s,
 * highlighted, and the highlight clears on acknowledgement.
 */
import { expect, test } from "@playwright/test";
import { DEMO, fileRequestForBlock, findBlockOnAq41, nightOf, signedIn } from "./override-fixtures";

test("an approval reaches the night assistant's open queue within 10 seconds, highlighted until acknowledged", async ({ browser }) => {
  test.setTimeout(120_000);
  const targetName = `Live transient ${Date.now().toString(36)}`;
  const pi = await signedIn(browser, DEMO.pi.email);
  const { telescopeId, start: blockStart, end: blockEnd } = await findBlockOnAq41(pi, (b) => b.kind !== "too");
  const aq41 = { id: telescopeId };
  const requestId = await fileRequestForBlock(pi, telescopeId, blockStart, blockEnd, targetName);

  // The night assistant opens that night's queue and acknowledges whatever was there before.
  const night = await signedIn(browser, DEMO.night_assistant.email);
  await night.goto(`/tonight/AQ41?night=${nightOf(blockStart)}`);
  await expect(night.getByTestId("tonight-sheet")).toHaveAttribute("data-hydrated", "true");
  // (The button is there only when something is pending; isEnabled() would wait for it forever.)
  const panel = night.getByTestId("changes-panel");
  if (Number(await panel.getAttribute("data-pending")) > 0) await night.getByRole("button", { name: "Acknowledge changes" }).click();
  await expect(panel).toHaveAttribute("data-pending", "0");

  // The director approves the middle hour of the block.
  const director = await signedIn(browser, DEMO.director.email);
  const middle = Math.round((blockStart + blockEnd) / 2 / 60_000) * 60_000;
  const decided = await director.request.post(`/api/v1/too-requests/${requestId}/decision`, {
    data: { decision: "approve", telescopeId: aq41!.id, start: new Date(middle - 30 * 60_000).toISOString(), end: new Date(middle + 30 * 60_000).toISOString(), note: "Go." },
  });
  expect(decided.status(), await decided.text()).toBe(200);
  const approvedAt = Date.now();

  // Within 10 s, without a reload: highlighted, named.
  const change = night.getByTestId("changes-panel").locator('[data-unacknowledged="true"]', { hasText: targetName });
  await expect(change.first()).toBeVisible({ timeout: 10_000 });
  expect(Date.now() - approvedAt).toBeLessThan(10_000);
  await expect(night.locator('tbody[data-kind="too"][data-changed="true"]').first()).toBeVisible();

  await night.getByRole("button", { name: "Acknowledge changes" }).click();
  await expect(night.getByTestId("changes-panel")).toHaveAttribute("data-pending", "0");
  await expect(night.locator('tbody[data-changed="true"]')).toHaveCount(0);
});
