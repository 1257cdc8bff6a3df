/**
 * The load-path tree: every node and every edge value drawn, upstream above the member and
 * downstream below it, deeper levels indented, large trees cut with a count, cyclic input safe.
 */
import { describe, expect, it } from "vitest";
import { MAX_ROWS_PER_SIDE, renderLoadPath } from "../../src/drawings/load-path";
import type { LoadPathBranch, LoadPathTree } from "../../src/drawings/load-path-types";
import { GIRDER_PATH } from "./fixtures";
import { allElements, byRole, numAttr, parseSvg, type SvgElement, texts } from "./svg-query";

function rowsOf(root: SvgElement): { side: string; depth: number; mark: string; y: number; x: number; edge?: SvgElement }[] {
  return byRole(root, "path-node").map((g) => {
    const rect = allElements(g).find((e) => e.tagName === "rect") as SvgElement;
    const mark = byRole(g, "path-mark")[0]?.textContent ?? "";
    const edge = byRole(g, "edge-value")[0];
    return { side: g.getAttribute("data-side") ?? "", depth: numAttr(g, "data-depth"), mark, y: numAttr(rect, "y"), x: numAttr(rect, "x"), ...(edge ? { edge } : {}) };
  });
}

function centreY(root: SvgElement): number {
  const rect = allElements(byRole(root, "path-centre")[0] as SvgElement).find((e) => e.tagName === "rect") as SvgElement;
  return numAttr(rect, "y");
}

describe("renderLoadPath", () => {
  const root = parseSvg(renderLoadPath(GIRDER_PATH));
  const rows = rowsOf(root);

  it("draws every node of both trees once, with its edge value and position", () => {
    expect(rows.map((r) => r.mark).sort()).toEqual(["B-7", "B-8", "C-4", "C-4 L2", "C-5", "Corridor", "F-4", "F-5", "Office", "Office"].sort());
    const b7 = rows.find((r) => r.mark === "B-7");
    expect(b7?.edge?.textContent).toBe("12.4 kip @ 10 ft");
    expect(numAttr(b7?.edge as SvgElement, "data-value")).toBe(12.4);
    expect(rows.find((r) => r.mark === "Corridor")?.edge?.textContent).toBe("0.8 kip/ft \u00B7 trib 8 ft");
    expect(rows.find((r) => r.mark === "C-4")?.edge?.textContent).toBe("15.3 kip \u00B7 start");
    expect(rows.find((r) => r.mark === "F-4")?.edge?.textContent).toBe("96.2 kip");
  });

  it("puts what the member carries above it and where its reactions go below it, deeper levels further in", () => {
    const cy = centreY(root);
    for (const r of rows) {
      if (r.side === "up") expect(r.y).toBeLessThan(cy);
      else expect(r.y).toBeGreaterThan(cy);
    }
    // Upstream reads downward toward the member: a beam's zones sit above the beam.
    const b7 = rows.find((r) => r.mark === "B-7") as (typeof rows)[number];
    const officeAboveB7 = rows.filter((r) => r.mark === "Office" && r.depth === 2 && r.y < b7.y);
    expect(officeAboveB7.length).toBeGreaterThanOrEqual(1);
    // Downstream reads downward toward the ground: C-4, then its lower storey, then the footing.
    const order = ["C-4", "C-4 L2", "F-4"].map((m) => rows.find((r) => r.mark === m) as (typeof rows)[number]);
    expect(order[0]!.y).toBeLessThan(order[1]!.y);
    expect(order[1]!.y).toBeLessThan(order[2]!.y);
    expect(order.map((r) => r.depth)).toEqual([1, 2, 3]);
    expect(order[0]!.x).toBeLessThan(order[1]!.x);
    expect(order[1]!.x).toBeLessThan(order[2]!.x);
    expect(texts(root)).toContain("CARRIES");
    expect(texts(root)).toContain("DELIVERS TO");
  });

  it("cuts a very large tree to the row limit, deepest levels first, and says how many were left out", () => {
    const beams: LoadPathBranch[] = Array.from({ length: 30 }, (_, i) => ({
      mark: `B-${i + 1}`,
      memberType: "beam",
      value: 2,
      children: [
        { mark: "Office", memberType: "zone", value: 0.5, unit: "kip/ft", children: [] },
        { mark: "Roof", memberType: "zone", value: 0.3, unit: "kip/ft", children: [] },
      ],
    }));
    const big: LoadPathTree = { ...GIRDER_PATH, upstream: beams, downstream: [] };
    const r = rowsOf(parseSvg(renderLoadPath(big)));
    expect(r.filter((x) => x.side === "up").length).toBeLessThanOrEqual(MAX_ROWS_PER_SIDE);
    // 30 beams fit; their 60 zones do not, so each beam row says it carries 2 more.
    expect(r.filter((x) => x.side === "up").map((x) => x.mark)).toEqual(beams.map((b) => b.mark));
    expect(r[0]?.edge?.textContent).toBe("2 kip (+2)");

    const wide: LoadPathTree = { ...GIRDER_PATH, upstream: Array.from({ length: 100 }, (_, i) => ({ mark: `J-${i}`, memberType: "joist", value: 1, children: [] })), downstream: [] };
    const wroot = parseSvg(renderLoadPath(wide));
    expect(rowsOf(wroot).length).toBe(MAX_ROWS_PER_SIDE - 1);
    expect(texts(wroot)).toContain(`\u2026 ${100 - (MAX_ROWS_PER_SIDE - 1)} more not shown`);
  });

  it("terminates on a cyclic object (a cycle the caller failed to break)", () => {
    const loop: { mark: string; memberType: string; value: number; children: LoadPathBranch[] } = { mark: "B-1", memberType: "beam", value: 1, children: [] };
    loop.children.push(loop);
    const svg = renderLoadPath({ ...GIRDER_PATH, upstream: [loop], downstream: [loop] });
    expect(rowsOf(parseSvg(svg)).length).toBeLessThanOrEqual(2 * MAX_ROWS_PER_SIDE);
  });

  it("draws a member with nothing listed on either side without section headers", () => {
    const alone = parseSvg(renderLoadPath({ ...GIRDER_PATH, upstream: [], downstream: [] }));
    expect(rowsOf(alone)).toHaveLength(0);
    expect(texts(alone)).not.toContain("CARRIES");
    expect(byRole(alone, "path-centre")).toHaveLength(1);
    expect(byRole(alone, "notice")).toHaveLength(1);
  });
});
