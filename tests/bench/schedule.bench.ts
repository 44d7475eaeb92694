/**
 * Schedule speed, against the production build started by scripts/bench.sh:
 * - GET /api/v1/schedule for a full semester of all three telescopes (target p95 < 50 ms);
 * - the calendar's week view rendering with data in Chromium (target < 1 s).
 */
import { chromium } from "@playwright/test";
import { printLoad, runLoad } from "./load";

const base = process.env.BENCH_BASE_URL;
const token = process.env.BENCH_TOKEN;
if (!base || !token) throw new Error("run through `npm run bench` (needs BENCH_BASE_URL and BENCH_TOKEN)");

const from = new Date(Date.now() - 30 * 86_400_000).toISOString();
const to = new Date(Date.now() + 151 * 86_400_000).toISOString();
const url = `${base}/api/v1/schedule?from=${encodeURIComponent(from)}&to=${encodeURIComponent(to)}`;
const probe = await fetch(url, { headers: { authorization: `Bearer ${token}` } });
const body = (await probe.json()) as { blocks: unknown[] };
console.log(`schedule API: one full semester, all telescopes = ${body.blocks.length} blocks, ${JSON.stringify(body).length} bytes`);

await runLoad({ url, connections: 4, amount: 40, headers: { authorization: `Bearer ${token}` } }); // warm-up
printLoad("schedule API, semester, 4 clients", await runLoad({ url, connections: 4, amount: 400, headers: { authorization: `Bearer ${token}` } }), "p95 < 50 ms");

const browser = await chromium.launch({
  executablePath: "/usr/bin/chromium",
  args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking"],
});
const page = await browser.newPage({ viewport: { width: 1400, height: 1000 } });
await page.goto(`${base}/sign-in`);
await page.getByLabel("E-mail").fill("observer@nightbreak.test");
await page.getByLabel("Password").fill("nightbreak-demo");
await page.getByRole("button", { name: "Sign in" }).click();
await page.waitForURL(`${base}/`);
// A block, not a twilight band (background events are drawn before the data arrives).
const firstBlock = page.locator(".fc-event:not(.fc-bg-event)").first();
async function loadCalendar(): Promise<number> {
  const started = performance.now();
  await page.goto(`${base}/schedule`);
  await firstBlock.waitFor();
  return performance.now() - started;
}
// The first load after the app starts also loads the page's server code and fills the
// browser's cache with the calendar's scripts: printed on its own.
const cold = await loadCalendar();
const renders: number[] = [];
for (let i = 0; i < 5; i++) renders.push(await loadCalendar());
await browser.close();
renders.sort((a, b) => a - b);
console.log(`calendar week view with data (navigation → first block drawn): first load after start ${cold.toFixed(0)} ms; then 5 loads: median ${renders[2]?.toFixed(0)} ms, worst ${renders[4]?.toFixed(0)} ms  [target < 1000 ms]`);
