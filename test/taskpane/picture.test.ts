/**
 * The pane's pictures: a drawing given a fixed pixel size for the image decoder, and the member
 * sheet and load path stacked into one SVG for copying or inserting. Checked by a strict XML
 * parse of the result (test/drawings/svg-query.ts) on drawings of invented members.
 */
import { describe, expect, it } from "vitest";
import { renderLoadPath, renderMemberSheet } from "../../src/drawings";
import { sizedSvg, stackSvgs } from "../../src/taskpane/picture";
import { CANTILEVER, HOSTILE_MARK, OVERHANG_BEAM } from "../drawings/fixtures";
import { allElements, byRole, parseSvg } from "../drawings/svg-query";

function viewBoxOf(markup: string): number[] {
  return parseSvg(markup).getAttribute("viewBox")!.split(/\s+/).map(Number);
}

describe("sizedSvg", () => {
  it("fixes width and height at the viewBox size times the scale, leaving the content as it is", () => {
    const svg = renderMemberSheet(OVERHANG_BEAM);
    const [, , w, h] = viewBoxOf(svg);
    const sized = sizedSvg(svg, 2);
    expect([sized.width, sized.height]).toEqual([Math.round(w! * 2), Math.round(h! * 2)]);
    const root = parseSvg(sized.markup);
    expect([root.getAttribute("width"), root.getAttribute("height")]).toEqual([String(sized.width), String(sized.height)]);
    expect(sized.markup.slice(sized.markup.indexOf(">") + 1)).toBe(svg.slice(svg.indexOf(">") + 1));
  });

  it("refuses markup without a viewBox", () => {
    expect(() => sizedSvg("<svg></svg>", 1)).toThrow(/viewBox/);
  });
});

describe("stackSvgs", () => {
  it("stacks drawings top to bottom in one well-formed SVG, every part kept, hostile marks still escaped", () => {
    const sheet = renderMemberSheet({ ...CANTILEVER, mark: HOSTILE_MARK });
    const path = renderLoadPath({ mark: HOSTILE_MARK, memberType: "beam", units: { force: "kip", length: "ft" }, upstream: [], downstream: [{ mark: "W-1", memberType: "wall", value: 10, children: [] }] });
    const stacked = stackSvgs([sheet, path]);
    const root = parseSvg(stacked);
    const [, , w, h] = viewBoxOf(stacked);
    const parts = [sheet, path].map(viewBoxOf);
    expect(w).toBe(Math.max(...parts.map((p) => p[2]!)));
    expect(h).toBeCloseTo(parts.reduce((s, p) => s + Math.round(p[3]!), 0), 9);
    const nested = allElements(root).filter((e) => e.tagName === "svg" && e !== root);
    expect(nested.map((e) => Number(e.getAttribute("y")))).toEqual([0, Math.round(parts[0]![3]!)]);
    expect(byRole(root, "member-sheet")).toHaveLength(1);
    expect(byRole(root, "load-path")).toHaveLength(1);
    expect(byRole(root, "reaction").length).toBe(byRole(parseSvg(sheet), "reaction").length);
    expect(stacked).not.toContain("<img");
  });
});
