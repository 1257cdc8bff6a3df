/**
 * The framing plan page in a real browser (Debian's Chromium through playwright-core): it shows
 * without console errors, the geometry the browser parsed equals the derived model (member end
 * points through the root's transform; tributary polygon areas by a shoelace over the browser's
 * own point lists), no two labels overlap as rendered, and hostile marks stay text (no script
 * element appears). Screenshots go to test-output/drawings/ for review by eye.
 */
import { existsSync, mkdirSync } from "node:fs";
import { resolve } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { planPage } from "../../src/cli/commands/plan";
import { renderFramingPlan } from "../../src/drawings/plan";
import { CHROMIUM, launch } from "../browser/harness";
import { fixtureModel, HOSTILE_MARK } from "./plan-fixture";
import { derive, readPlan } from "../../src/engine/framing";
import type { CellValue } from "../../src/engine/takedown/types";

/** A dense invented level: 10 x 6 bays of 30 x 24 ft, 5 infill beams a bay, 513 members and columns. */
function denseModel() {
  const f: CellValue[][] = [["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2"]];
  const d: CellValue[][] = [["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2"]];
  for (let i = 0; i <= 10; i++) for (let j = 0; j <= 6; j++) f.push([`C${i}.${j}`, "column", "L1", i * 30, j * 24]);
  for (let i = 0; i <= 10; i++) for (let j = 0; j < 6; j++) f.push([`G${i}.${j}`, "girder", "L1", i * 30, j * 24, i * 30, (j + 1) * 24]);
  for (let i = 0; i < 10; i++) {
    for (let j = 0; j <= 6; j++) f.push([`E${i}.${j}`, "beam", "L1", i * 30, j * 24, (i + 1) * 30, j * 24]);
    for (let j = 0; j < 6; j++) {
      for (let k = 1; k <= 5; k++) f.push([`B${i}.${j}.${k}`, "beam", "L1", i * 30, j * 24 + k * 4, (i + 1) * 30, j * 24 + k * 4]);
      d.push([`D${i}.${j}`, "L1", "one-way", "Office", "y", i * 30, j * 24, (i + 1) * 30, (j + 1) * 24]);
    }
  }
  const t = (sheet: string, values: CellValue[][]) => ({ sheet, top: 0, left: 0, values });
  const r = readPlan({ framing: t("Framing", f), decks: t("Decks", d), levels: t("Levels", [["Level", "Elevation"], ["L1", 13]]) });
  return { plan: r.plan, grids: r.grids, derivation: derive(r.plan), units: "US" as const };
}

const OUT = resolve(__dirname, "..", "..", "test-output", "drawings");
const model = fixtureModel();
const missing = existsSync(CHROMIUM) ? null : `${CHROMIUM} is missing (apt-get install chromium).`;
if (missing !== null) {
  if (process.env.CI) throw new Error(missing);
  console.warn(`SKIPPED plan drawings in Chromium: ${missing}`);
}

interface Seen {
  readonly errors: string[];
  readonly scripts: number;
  readonly members: { mark: string; x1: number; y1: number; x2: number; y2: number }[];
  readonly areas: Record<string, number>;
  readonly overlaps: string[];
  readonly titles: string[];
}

async function inspect(page: Page, html: string): Promise<Seen> {
  const errors: string[] = [];
  page.on("console", (m) => {
    if (m.type() === "error" || m.type() === "warning") errors.push(m.text());
  });
  page.on("pageerror", (e) => errors.push(e.message));
  await page.setContent(html);
  await page.evaluate(() => document.fonts.ready);
  const seen = await page.evaluate(() => {
    const root = document.querySelector('svg[data-role="framing-plan"]') as SVGSVGElement;
    const n = (e: Element, a: string) => Number(e.getAttribute(a));
    const s = n(root, "data-scale"), xmin = n(root, "data-xmin"), ymax = n(root, "data-ymax"), left = n(root, "data-left"), top = n(root, "data-top");
    const inv = (x: number, y: number) => [xmin + (x - left) / s, ymax - (y - top) / s] as const;
    const members = Array.from(root.querySelectorAll('[data-role="plan-member"]')).map((g) => {
      const l = g.querySelector("line") as SVGLineElement;
      const [x1, y1] = inv(l.x1.baseVal.value, l.y1.baseVal.value);
      const [x2, y2] = inv(l.x2.baseVal.value, l.y2.baseVal.value);
      return { mark: g.getAttribute("data-plan-mark") ?? "", x1, y1, x2, y2 };
    });
    const areas: Record<string, number> = {};
    for (const p of Array.from(root.querySelectorAll('[data-role="plan-tributary"]')) as SVGPolygonElement[]) {
      const pts = Array.from(p.points).map((q) => inv(q.x, q.y));
      let a = 0;
      pts.forEach(([x1, y1], i) => {
        const [x2, y2] = pts[(i + 1) % pts.length]!;
        a += x1 * y2 - x2 * y1;
      });
      const mark = p.getAttribute("data-plan-mark") ?? "";
      areas[mark] = (areas[mark] ?? 0) + Math.abs(a) / 2;
    }
    const labels = Array.from(root.querySelectorAll('[data-role="plan-member-label"], [data-role="plan-column-label"], [data-role="plan-grid-name"], [data-role="plan-deck-label"]')).map((t) => ({ text: t.textContent ?? "", box: t.getBoundingClientRect() }));
    const overlaps: string[] = [];
    labels.forEach((a, i) => {
      for (const b of labels.slice(0, i)) {
        const w = Math.min(a.box.right, b.box.right) - Math.max(a.box.left, b.box.left);
        const h = Math.min(a.box.bottom, b.box.bottom) - Math.max(a.box.top, b.box.top);
        if (w > 0.5 && h > 0.5) overlaps.push(`${b.text} / ${a.text}`);
      }
    });
    const titles = Array.from(root.querySelectorAll("title")).map((t) => t.textContent ?? "");
    return { scripts: document.querySelectorAll("script").length, members, areas, overlaps, titles };
  });
  return { ...seen, errors };
}

describe.skipIf(missing !== null)("framing plan in Chromium", () => {
  let page: Page;
  let close: () => Promise<void>;

  beforeAll(async () => {
    mkdirSync(OUT, { recursive: true });
    const browser = await launch(1000, 900);
    close = browser.close;
    page = await browser.context.newPage();
  });

  afterAll(async () => {
    await close?.();
  });

  it("shows the plan page without console errors; geometry and areas as derived; labels apart; marks stay text", async () => {
    const html = planPage("fixture.xlsx", [{ heading: "Level 2", svg: renderFramingPlan(model, "2", { selected: HOSTILE_MARK }) }, { heading: "Level Roof", svg: renderFramingPlan(model, "Roof") }], [`Framing!A2: a problem named with "quotes" & <tags>`]);
    const seen = await inspect(page, html);
    expect(seen.errors).toEqual([]);
    expect(seen.scripts).toBe(0);
    expect(seen.titles.some((t) => t.includes(HOSTILE_MARK))).toBe(true);
    const s = 720; // drawing units across; coordinates are rounded to 0.01 units
    for (const m of model.derivation.members.filter((x) => x.level === "2" && x.type !== "column" && x.type !== "foundation")) {
      const got = seen.members.find((g) => g.mark === m.mark)!;
      for (const [a, b] of [[got.x1, m.x1], [got.y1, m.y1], [got.x2, m.x2], [got.y2, m.y2]] as const) expect(Math.abs(a - b), m.mark).toBeLessThan((0.01 * 54) / s + 1e-6);
      if (m.tributaryArea > 0) expect(Math.abs(seen.areas[m.mark]! - m.tributaryArea) / m.tributaryArea, m.mark).toBeLessThan(1e-3);
    }
    expect(seen.overlaps).toEqual([]);
    await page.locator("svg").first().screenshot({ path: resolve(OUT, "plan-level-2.png") });
  });

  it("a dense level (513 members and columns): labels that would crowd are left to the tooltips, none overlap", async () => {
    await page.setViewportSize({ width: 1000, height: 900 });
    const dense = denseModel();
    expect(dense.derivation.problems).toEqual([]);
    const seen = await inspect(page, `<!doctype html><html><body style="margin:0;width:1000px">${renderFramingPlan(dense, "L1")}</body></html>`);
    expect(seen.errors).toEqual([]);
    expect(seen.overlaps).toEqual([]);
    // every member and column still carries its mark in a title
    for (const m of dense.derivation.members.filter((x) => x.type !== "foundation")) expect(seen.titles.some((t) => t.startsWith(`${m.mark} (`) || t.startsWith(`Column ${m.mark}`)), m.mark).toBe(true);
    await page.locator("svg").screenshot({ path: resolve(OUT, "plan-dense.png") });
  });

  it("a 320 px wide pane shows the same drawing scaled, without errors", async () => {
    await page.setViewportSize({ width: 320, height: 700 });
    const seen = await inspect(page, `<!doctype html><html><body style="margin:0">${renderFramingPlan(model, "Roof", { selected: "B2R" })}</body></html>`);
    expect(seen.errors).toEqual([]);
    const width = await page.evaluate(() => document.querySelector("svg")!.getBoundingClientRect().width);
    expect(width).toBeCloseTo(320, 0);
    await page.locator("svg").screenshot({ path: resolve(OUT, "plan-roof-320.png") });
  });
});
