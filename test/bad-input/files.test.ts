/**
 * Bad input through .xlsx files and the command line (issue classes A and E): numbers stored as
 * text cells in the workbook (as a CSV import leaves them) give the same takedown as numbers, by
 * hand; results that overflow are problems with exit status 1 in `takedown` and `report`, and the
 * report prints "?" only where a listed problem says why. The input file is never changed.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import type { RawCellContent } from "hyperformula";
import { cli, writeSheets } from "../report/helpers";
import { handReactions } from "../workbook/takedown-helpers";
import { badNumbers } from "./helpers";

const HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)"];

function sheets(span: RawCellContent, trib: RawCellContent, at: RawCellContent, dead: RawCellContent): Record<string, RawCellContent[][]> {
  return {
    Zones: [
      ["Zone", "D (psf)", "L (psf)", "Reducible"],
      ["OFF", dead, 80, "no"],
    ],
    Members: [
      HEADERS,
      ["B1", "beam", "2", span, "OFF", trib, "G1", at, "W1", null],
      ["G1", "girder", "2", 30, null, null, "W1", null, "W1", null],
      ["W1", "wall", null, null, null, null, null, null, null, null],
    ],
  };
}

describe("bad input in workbook files", () => {
  it("text cells holding numbers are read as those numbers by `takedown`, add-in and hand-off alike", async () => {
    const dir = mkdtempSync(join(tmpdir(), "loadpath-bad-"));
    const input = join(dir, "text.xlsx");
    await writeSheets(input, sheets(" 24 ", "7.5", "10", "50"));
    const before = readFileSync(input);
    const hand = handReactions(24, [], [{ w: (50 * 7.5) / 1000, a: 0, b: 24 }]);
    const girder = handReactions(30, [{ p: hand.left, x: 10 }]);
    for (const native of [false, true]) {
      const json = join(dir, `out${native ? "-native" : ""}.json`);
      const r = await cli("takedown", input, "-o", join(dir, `out${native ? "-native" : ""}.xlsx`), "--json", json, ...(native ? ["--native"] : []));
      expect(r.err).toEqual([]);
      expect(r.status).toBe(0);
      const out = JSON.parse(readFileSync(json, "utf8")) as { members: Record<string, { reactions: { D: number[] } }> };
      expect(badNumbers(out)).toEqual([]);
      expect(out.members.B1!.reactions.D[0]).toBeCloseTo(hand.left, 10);
      expect(out.members.G1!.reactions.D[0]).toBeCloseTo(girder.left, 10);
    }
    expect(readFileSync(input).equals(before)).toBe(true);
  });

  it("results that overflow are listed problems with exit 1 in takedown and report; the report's '?' is explained", async () => {
    const dir = mkdtempSync(join(tmpdir(), "loadpath-bad-"));
    const input = join(dir, "huge.xlsx");
    await writeSheets(input, sheets(1e150, 1e150, 10, 1e200));
    const before = readFileSync(input);
    const t = await cli("takedown", input, "-o", join(dir, "out.xlsx"), "--json", join(dir, "out.json"));
    expect(t.status).toBe(1);
    expect(t.err.join("\n")).toMatch(/B1: .* on the generated sheet/);
    const json = JSON.parse(readFileSync(join(dir, "out.json"), "utf8")) as { problems: { code: string; mark?: string }[] };
    expect(json.problems.filter((p) => p.code === "errorResult").map((p) => p.mark)).toContain("B1");
    const report = join(dir, "report.html");
    const r = await cli("report", input, "-o", report);
    expect(r.status).toBe(1);
    const html = readFileSync(report, "utf8");
    expect(html).toContain("Problems found in the tables");
    expect(html).toMatch(/B1: .* on the generated sheet/);
    expect(readFileSync(input).equals(before)).toBe(true);
  });
});
