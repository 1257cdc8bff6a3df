/**
 * The drawings in a real browser (Debian's Chromium through playwright-core, no download): at
 * the pane's narrowest width (320 px) no text is clipped, no two texts overlap and every text is
 * no wider than the layout assumed, with Arial-metric fonts and with DejaVu Sans (the fallback
 * of a bare Linux machine). Screenshots go to test-output/drawings/ for review by eye.
 */
import { mkdirSync } from "node:fs";
import { resolve } from "node:path";
import type { Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { renderLoadPath } from "../../src/drawings/load-path";
import { textWidth } from "../../src/drawings/metrics";
import { renderMemberSheet } from "../../src/drawings/sheet";
import { launch } from "../browser/harness";
import { GIRDER_PATH, OVERHANG_BEAM_EI, REVIEW_SHEETS } from "./fixtures";

const OUT = resolve(__dirname, "..", "..", "test-output", "drawings");
const PANE_WIDTH = 320;

const FONTS = {
  arial: "",
  dejavu: "<style>svg text { font-family: 'DejaVu Sans' !important; }</style>",
} as const;

interface Measured {
  readonly text: string;
  readonly size: number;
  readonly bold: boolean;
  readonly x0: number;
  readonly y0: number;
  readonly x1: number;
  readonly y1: number;
}

interface Layout {
  readonly svg: { x0: number; y0: number; x1: number; y1: number };
  readonly texts: readonly Measured[];
  /** Texts that an arrow of another load runs through (line-load labels excepted: haloed). */
  readonly crossed: readonly string[];
}

async function show(page: Page, svg: string, font: keyof typeof FONTS, width: number): Promise<Layout> {
  await page.setViewportSize({ width, height: 900 });
  await page.setContent(`<!doctype html><html><head>${FONTS[font]}</head><body style="margin:0">${svg}</body></html>`);
  await page.evaluate(() => document.fonts.ready);
  return page.evaluate(() => {
    const root = document.querySelector("svg") as SVGSVGElement;
    const r = root.getBoundingClientRect();
    const texts = Array.from(root.querySelectorAll("text")).map((t) => {
      const b = t.getBoundingClientRect();
      return {
        text: t.textContent ?? "",
        size: Number(t.getAttribute("font-size")),
        bold: t.getAttribute("font-weight") === "bold",
        x0: b.left,
        y0: b.top,
        x1: b.right,
        y1: b.bottom,
      };
    });
    const crossed: string[] = [];
    for (const g of Array.from(root.querySelectorAll('[data-role="point-load"], [data-role="moment-load"]'))) {
      const shaft = g.querySelector("line");
      if (shaft === null) continue;
      const a = shaft.getBoundingClientRect();
      for (const t of Array.from(root.querySelectorAll("text"))) {
        const role = t.getAttribute("data-role") ?? "";
        if (g.contains(t) || role === "line-label" || role === "line-name") continue;
        const b = t.getBoundingClientRect();
        // A vertical line's box has no width: give the shaft its stroke's width back.
        const w = Math.min(a.right + 0.8, b.right) - Math.max(a.left - 0.8, b.left);
        const h = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
        if (w > 0 && h > 2) crossed.push(t.textContent ?? "");
      }
    }
    return { svg: { x0: r.left, y0: r.top, x1: r.right, y1: r.bottom }, texts, crossed };
  });
}

function overlapArea(a: Measured, b: Measured): number {
  const w = Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0);
  const h = Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0);
  return w > 0.5 && h > 0.5 ? w * h : 0;
}

function problems(layout: Layout): string[] {
  const out: string[] = [];
  const s = layout.svg;
  const unitsPerPx = PANE_WIDTH / (s.x1 - s.x0);
  layout.texts.forEach((t, i) => {
    if (t.text.trim() === "") return;
    if (t.x0 < s.x0 - 0.5 || t.x1 > s.x1 + 0.5 || t.y0 < s.y0 - 0.5 || t.y1 > s.y1 + 0.5) out.push(`clipped: "${t.text}"`);
    const drawn = (t.x1 - t.x0) * unitsPerPx;
    const assumed = textWidth(t.text, t.size, t.bold);
    if (drawn > assumed + 0.5) out.push(`wider than assumed: "${t.text}" ${drawn.toFixed(1)} > ${assumed.toFixed(1)}`);
    for (let j = 0; j < i; j++) {
      const u = layout.texts[j] as Measured;
      if (u.text.trim() !== "" && overlapArea(t, u) > 1) out.push(`overlap: "${u.text}" / "${t.text}"`);
    }
  });
  return out;
}

const drawings: [string, string][] = [
  ...Object.entries(REVIEW_SHEETS).map(([name, d]): [string, string] => [name, renderMemberSheet(d)]),
  ["load-path", renderLoadPath(GIRDER_PATH)],
];

describe("drawings in Chromium", () => {
  let page: Page;
  let close: () => Promise<void>;

  beforeAll(async () => {
    mkdirSync(OUT, { recursive: true });
    const browser = await launch(PANE_WIDTH, 900);
    close = browser.close;
    page = await browser.context.newPage();
  });

  afterAll(async () => {
    await close?.();
  });

  for (const [name, svg] of drawings) {
    for (const font of Object.keys(FONTS) as (keyof typeof FONTS)[]) {
      it(`${name} at ${PANE_WIDTH} px, ${font} metrics: fills the width, nothing clipped or overlapping`, async () => {
        const layout = await show(page, svg, font, PANE_WIDTH);
        expect(layout.svg.x1 - layout.svg.x0).toBeCloseTo(PANE_WIDTH, 0);
        expect(layout.texts.length).toBeGreaterThan(5);
        expect(problems(layout)).toEqual([]);
        expect(layout.crossed, "labels crossed by another load's arrow").toEqual([]);
        await page.locator("svg").screenshot({ path: resolve(OUT, `${name}-${PANE_WIDTH}-${font}.png`) });
      });
    }
  }

  it("scales with a wider pane (640 px): same drawing, twice the size", async () => {
    const svg = renderMemberSheet(OVERHANG_BEAM_EI);
    const narrow = await show(page, svg, "arial", PANE_WIDTH);
    const wide = await show(page, svg, "arial", 2 * PANE_WIDTH);
    expect(wide.svg.x1 - wide.svg.x0).toBeCloseTo(2 * PANE_WIDTH, 0);
    expect((wide.svg.y1 - wide.svg.y0) / (narrow.svg.y1 - narrow.svg.y0)).toBeCloseTo(2, 2);
    expect(problems(wide)).toEqual([]);
    await page.locator("svg").screenshot({ path: resolve(OUT, `overhang-beam-${2 * PANE_WIDTH}.png`) });
  });
});
