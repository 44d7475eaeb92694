import { expect, test, type Page } from "@playwright/test";
import { DEMO, signIn } from "./helpers";

/**
 * Night vision must keep a dark-adapted eye dark: with it on, no visible element may be
 * drawn brighter than this relative luminance (WCAG definition, 0 black … 1 white). The
 * brightest colour of the red palette (#d02525) is about 0.15; white is 1, the amber
 * flare about 0.27.
 */
const MAX_LUMINANCE = 0.16;

interface BrightThing {
  element: string;
  property: string;
  value: string;
  luminance: number;
  why: string;
}

/**
 * Every visible element's text colour (where it draws text), background, borders and SVG
 * paint, measured by painting each computed colour into a 1×1 canvas over black and
 * reading the pixel back: that works whatever syntax the browser reports (rgb(), lab(),
 * oklch(), color(srgb …)), and composites translucent colours the way the black page does.
 */
async function brightThings(page: Page, maxLuminance: number): Promise<BrightThing[]> {
  return page.evaluate((limit) => {
    const canvas = document.createElement("canvas");
    canvas.width = 1;
    canvas.height = 1;
    const ctx = canvas.getContext("2d", { willReadFrequently: true });
    if (!ctx) throw new Error("no 2d canvas");
    const SENTINEL = "#010203";
    const channel = (v: number) => {
      const c = v / 255;
      return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
    };
    const measure = (color: string): { rgb: [number, number, number]; luminance: number } | null => {
      ctx.globalCompositeOperation = "source-over";
      ctx.fillStyle = "#000000";
      ctx.fillRect(0, 0, 1, 1);
      ctx.fillStyle = SENTINEL;
      ctx.fillStyle = color;
      if (ctx.fillStyle === SENTINEL && color !== SENTINEL) return null; // the canvas could not read it
      ctx.fillRect(0, 0, 1, 1);
      const [r = 0, g = 0, b = 0] = ctx.getImageData(0, 0, 1, 1).data;
      return { rgb: [r, g, b], luminance: 0.2126 * channel(r) + 0.7152 * channel(g) + 0.0722 * channel(b) };
    };
    const describe = (el: Element) => {
      const id = el.id ? `#${el.id}` : "";
      const cls = typeof el.className === "string" && el.className ? `.${el.className.trim().split(/\s+/).slice(0, 3).join(".")}` : "";
      const text = (el.textContent ?? "").trim().slice(0, 30);
      return `<${el.tagName.toLowerCase()}${id}${cls}>${text ? ` "${text}"` : ""}`;
    };
    const drawsText = (el: Element) =>
      ["INPUT", "TEXTAREA", "SELECT", "BUTTON"].includes(el.tagName) ||
      [...el.childNodes].some((n) => n.nodeType === Node.TEXT_NODE && (n.textContent ?? "").trim() !== "");
    const SHAPES = new Set(["path", "circle", "rect", "line", "polyline", "polygon", "ellipse", "text"]);

    const found: Array<{ element: string; property: string; value: string; luminance: number; why: string }> = [];
    const check = (el: Element, property: string, value: string) => {
      if (!value || value === "none" || value === "transparent") return;
      const m = measure(value);
      if (!m) {
        found.push({ element: describe(el), property, value, luminance: NaN, why: "unreadable colour" });
        return;
      }
      const [r, g, b] = m.rgb;
      if (m.luminance > limit) found.push({ element: describe(el), property, value, luminance: m.luminance, why: "too bright" });
      // Night vision is red: any visible amount of green or blue light is a leak.
      else if (Math.max(r, g, b) >= 48 && (g > 0.5 * r || b > 0.5 * r)) found.push({ element: describe(el), property, value, luminance: m.luminance, why: "not red" });
    };

    for (const el of [document.documentElement, ...document.body.querySelectorAll("*")]) {
      if (el !== document.documentElement && !el.checkVisibility({ checkOpacity: true, checkVisibilityCSS: true })) continue;
      const rect = el.getBoundingClientRect();
      if (el !== document.documentElement && (rect.width === 0 || rect.height === 0)) continue;
      const style = getComputedStyle(el);
      if (drawsText(el)) check(el, "color", style.color);
      check(el, "background-color", style.backgroundColor);
      for (const side of ["top", "right", "bottom", "left"] as const) {
        const width = parseFloat(style.getPropertyValue(`border-${side}-width`));
        const lineStyle = style.getPropertyValue(`border-${side}-style`);
        if (width > 0 && lineStyle !== "none" && lineStyle !== "hidden") check(el, `border-${side}-color`, style.getPropertyValue(`border-${side}-color`));
      }
      if (SHAPES.has(el.tagName.toLowerCase())) {
        check(el, "fill", style.fill.startsWith("url(") ? "" : style.fill);
        check(el, "stroke", style.stroke.startsWith("url(") ? "" : style.stroke);
      }
    }
    return found;
  }, maxLuminance);
}

async function openTonight(page: Page) {
  await signIn(page, DEMO.night_assistant.email);
  await page.goto("/tonight/AQ41");
  await expect(page.getByRole("heading", { level: 1, name: /Tonight on AQ41/ })).toBeVisible();
  // Clicks before hydration would be lost: wait for the client to take over.
  await expect(page.getByTestId("tonight-sheet")).toHaveAttribute("data-hydrated", "true");
}

test("the night assistant switches on night vision on tonight's queue and nothing on screen is brighter than dim red", async ({ page }) => {
  await openTonight(page);
  await expect(page.getByTestId("live-indicator")).toHaveAttribute("data-state", "live");
  const toggle = page.getByRole("button", { name: "Night vision" });
  await expect(toggle).toHaveAttribute("aria-pressed", "false");
  // The day theme is bright, so the check would find plenty: a sanity check of the check.
  expect((await brightThings(page, MAX_LUMINANCE)).length).toBeGreaterThan(0);

  await toggle.click();
  await expect(page.locator("html")).toHaveAttribute("data-theme", "red");
  await expect(toggle).toHaveAttribute("aria-pressed", "true");
  // Open a night-log form too, so its controls are measured.
  const logSummary = page.locator("summary", { hasText: /^Log outcome for / }).first();
  if (await logSummary.count()) {
    await logSummary.click();
    await expect(page.getByRole("group", { name: "Outcome" }).first()).toBeVisible();
  }
  expect(await brightThings(page, MAX_LUMINANCE)).toEqual([]);

  // Remembered: a reload comes back red without a bright first paint, and only on tonight's pages.
  await page.reload();
  await expect(page.locator("html")).toHaveAttribute("data-theme", "red");
  await expect(page.getByRole("button", { name: "Night vision" })).toHaveAttribute("aria-pressed", "true");
  expect(await brightThings(page, MAX_LUMINANCE)).toEqual([]);
  const nav = page.getByRole("navigation", { name: "Main" });
  await nav.getByRole("link", { name: "Home", exact: true }).click();
  await expect(page.getByRole("heading", { name: DEMO.night_assistant.section })).toBeVisible();
  await expect(page.locator("html")).not.toHaveAttribute("data-theme", "red");
  await nav.getByRole("link", { name: "Tonight", exact: true }).click();
  await page.getByRole("link", { name: /^AQ41/ }).click();
  await expect(page.locator("html")).toHaveAttribute("data-theme", "red");
});

test("tonight's queue prints as a clean night sheet", async ({ page }) => {
  await openTonight(page);
  // Print from night vision, the likeliest case at the telescope: the sheet is still ink on paper.
  await page.getByRole("button", { name: "Night vision" }).click();
  await expect(page.locator("html")).toHaveAttribute("data-theme", "red");
  await page.emulateMedia({ media: "print" });

  await expect(page.getByRole("heading", { level: 1, name: /Tonight on AQ41/ })).toBeVisible();
  await expect(page.getByRole("heading", { name: /^Queue/ })).toBeVisible();
  await expect(page.getByText("Feasibility figures are planning aids; opening, pointing and closing the telescope follow the observatory's own procedures and safety rules.")).toBeVisible();
  await expect(page.getByText("Sunset", { exact: true })).toBeVisible();
  // The app's frame and the controls stay off paper.
  await expect(page.getByRole("navigation", { name: "Main" })).toBeHidden();
  await expect(page.getByRole("button", { name: "Night vision" })).toBeHidden();
  await expect(page.getByRole("button", { name: "Print night sheet" })).toBeHidden();
  await expect(page.getByRole("button", { name: "Acknowledge changes" })).toBeHidden();
  await expect(page.getByTestId("live-indicator")).toBeHidden();
  for (const summary of await page.locator("summary", { hasText: /^Log outcome for / }).all()) await expect(summary).toBeHidden();

  const colours = await page.evaluate(() => ({
    page: getComputedStyle(document.documentElement).backgroundColor,
    text: getComputedStyle(document.body).color,
  }));
  expect(colours).toEqual({ page: "rgb(255, 255, 255)", text: "rgb(0, 0, 0)" });

  await page.emulateMedia({ media: "screen" });
  await expect(page.getByRole("button", { name: "Night vision" })).toBeVisible();
});

test("the queue's rows are in time order and each shows UT and site time", async ({ page }) => {
  await openTonight(page);
  const groups = page.locator("tbody[data-block-id]");
  const count = await groups.count();
  const starts: string[] = [];
  for (let i = 0; i < count; i++) starts.push((await groups.nth(i).locator("time").first().getAttribute("datetime")) ?? "");
  expect([...starts].sort()).toEqual(starts);
  if (count > 0) {
    await expect(groups.first().getByRole("cell").nth(0)).toContainText(/\d\d:\d\d–\d\d:\d\d/);
    await expect(groups.first().getByRole("cell").nth(1)).toContainText(/GMT|[A-Z]{3,4}/);
  }
});
