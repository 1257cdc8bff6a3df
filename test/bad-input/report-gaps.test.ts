/**
 * The report never prints "?" silently: a member whose printed numbers include one that is not
 * finite is a listed problem at its row of the generated sheet (unless the build listed it already),
 * and so is a beam whose governing values the engine refuses.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { describe, expect, it } from "vitest";
import { collectTakedown, renderReport } from "../../src/report";
import { reportGaps } from "../../src/report/collect";
import { buildOn } from "./helpers";

const HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "End support"];

describe("report gaps", () => {
  it("a member with a number the report cannot print is listed; a sound takedown has none and prints no '?'", async () => {
    const { port, result } = await buildOn({ Zones: [["Zone", "D (psf)"], ["OFF", 50]], Members: [HEADERS, ["B1", "beam", "2", 20, "OFF", 5, "W1", "W1"], ["W1", "wall"]] });
    expect(result.problems).toEqual([]);
    const record = await collectTakedown(port, { zones: "Zones", members: "Members", units: "US" }, result.json!);
    expect(record.json.problems).toEqual([]);
    const html = renderReport({ record, project: "p", sourceFile: "f.xlsx", date: "2026-01-01", members: ["B1", "W1"], generator: "Loadpath" });
    expect(html).not.toMatch(/>\?</);
    // The same record with one reaction the sheet could not compute.
    const b1 = record.members.get("B1")!;
    const broken = new Map(record.members);
    broken.set("B1", { ...b1, reactions: { ...b1.reactions, D: [Number.NaN, 5] } });
    const gaps = reportGaps(record.plan, record.model, broken, []);
    expect(gaps.map((g) => [g.code, g.mark, `${g.sheet}!${g.cell}`])).toEqual([["errorResult", "B1", `Takedown!A${record.plan.places[0]!.row + 1}`]]);
    expect(gaps[0]!.message).toContain("B1.reactions.D[0]");
    // Listed by the build already: not listed twice.
    expect(reportGaps(record.plan, record.model, broken, gaps)).toEqual([]);
    // A member whose governing values cannot be found (here a support placed past its end, which the
    // beam engine refuses) is listed with the engine's message, not left as a note only.
    const outside = new Map(record.members);
    outside.set("B1", { ...b1, supports: b1.supports.map((s, k) => (k === 1 ? { ...s, x: 25 } : s)) });
    const refused = reportGaps(record.plan, record.model, outside, []);
    expect(refused.map((g) => [g.code, g.mark])).toEqual([["errorResult", "B1"]]);
    expect(refused[0]!.message).toMatch(/^B1: the report cannot give its governing values: .*outside the member/);
  });
});
