/**
 * memberLoads / loadsOfMembers: the loads, supports and reactions of each member read back from
 * the computed takedown sheet, checked against the hand statics of the invented framing of
 * test/report/framing.ts (never against the engine's own output): the zone row over the trib
 * width, a partial Loads-table line load, a Loads-table point load, the reactions a girder
 * receives with the marks and positions they come from, a column's loads and the foundation.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { beforeAll, describe, expect, it } from "vitest";
import { checkPath, planTakedown, type CellValue } from "../../../src/engine/takedown";
import { loadsOfMembers, memberLoads, type MemberLoads, type MemberLoadsSource } from "../../../src/engine/takedown/member-loads";
import { sheetTitle } from "../../../src/workbook/takedown-build";
import type { TakedownOptions } from "../../../src/workbook/takedown-api";
import { buildOn } from "../../workbook/takedown-helpers";
import { framingSheets, handFraming } from "../../report/framing";

const close = (actual: number | undefined, expected: number): void => {
  expect(actual).toBeTypeOf("number");
  expect(Math.abs(actual! - expected)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(expected)));
};

let source: MemberLoadsSource;
let all: ReadonlyMap<string, MemberLoads>;
const hand = handFraming();

beforeAll(async () => {
  const sheets = framingSheets();
  const { port, result } = await buildOn(sheets);
  expect(result.problems).toEqual([]);
  const options: TakedownOptions = { zones: "Zones", members: "Members", loads: "Loads", units: "US" };
  const table = (name: string) => ({ sheet: name, top: 0, left: 0, values: sheets[name]! as CellValue[][] });
  const planned = planTakedown({ zones: table("Zones"), members: table("Members"), loads: table("Loads"), units: "US", sheet: "Takedown", title: sheetTitle(options) });
  const values = port.hf.getSheetValues(port.hf.getSheetId("Takedown")!);
  const path = checkPath(planned.model!);
  source = {
    model: planned.model!,
    plan: planned.plan!,
    deliveries: path.deliveries,
    placedLoads: path.placedLoads,
    read: (row, col) => values[row]?.[col] as CellValue | undefined,
  };
  all = loadsOfMembers(source);
});

describe("memberLoads", () => {
  it("reads a beam's zone row, its partial Loads-table line load, supports and reactions", () => {
    const b1 = memberLoads(source, "B1")!;
    expect(b1.type).toBe("beam");
    expect(b1.length).toBe(24);
    expect(b1.supports.map((s) => [s.end, s.mark, s.type, s.x, s.at])).toEqual([
      ["start", "G1", "girder", 0, 10],
      ["end", "G2", "girder", 24, 10],
    ]);
    const [zone, strip] = b1.loads;
    expect(b1.loads).toHaveLength(2);
    expect(zone!.kind).toBe("line");
    expect(zone!.origin).toEqual({ kind: "zone", zone: "OFF", extras: ["D"] });
    expect([zone!.width, zone!.start, zone!.end]).toEqual([10, 0, 24]);
    close(zone!.magnitudes.D, hand.b1.wD);
    close(zone!.magnitudes.L, hand.b1.wL);
    // The reducible part is the zone's live load; the Loads-table live load is not reducible.
    close(zone!.magnitudes.Lred, hand.b1.wL);
    close(zone!.magnitudes.AT, 10);
    expect(strip!.origin).toEqual({ kind: "loadsRow", sheet: "Loads", row: 2, zone: null, loadCase: "L" });
    expect([strip!.start, strip!.end]).toEqual([0, 12]);
    close(strip!.magnitudes.L, hand.b1.strip);
    expect(strip!.magnitudes.Lred).toBeUndefined();
    close(b1.reactions.D![0], hand.B1.D.left);
    close(b1.reactions.D![1], hand.B1.D.right);
    close(b1.reactions.L![0], hand.B1.L.left);
    close(b1.reactions.L![1], hand.B1.L.right);
    expect(b1.reducibleLive).toBe("Lred");
    close(b1.liveReduction!.areaT, hand.B1.areaT);
    expect(b1.liveReduction!.kll).toBe(2);
    close(b1.liveReduction!.llrFactor, hand.B1.llr);
  });

  it("reads a Loads-table point load at its position", () => {
    const b2 = all.get("B2")!;
    const unit = b2.loads.find((l) => l.kind === "point")!;
    expect(unit.origin).toEqual({ kind: "loadsRow", sheet: "Loads", row: 3, zone: null, loadCase: "D" });
    expect([unit.start, unit.end]).toEqual([8, null]);
    close(unit.magnitudes.D, 3);
  });

  it("gives a girder the reactions it receives with their marks, ends and positions", () => {
    const g1 = all.get("G1")!;
    const received = g1.loads.filter((l) => l.kind === "reaction");
    expect(received.map((l) => [l.origin, l.start])).toEqual([
      [{ kind: "member", mark: "B1", type: "beam", end: "start" }, 10],
      [{ kind: "member", mark: "B2", type: "beam", end: "start" }, 18],
    ]);
    close(received[0]!.magnitudes.D, hand.B1.D.left);
    close(received[1]!.magnitudes.L, hand.B2.L.left);
    expect(g1.supports.map((s) => [s.mark, s.type, s.x, s.at])).toEqual([
      ["C1", "column", 0, null],
      ["C2", "column", 24, null],
    ]);
    close(g1.reactions.D![0], hand.G1.D.left);
    close(g1.reactions.L![1], hand.G1.L.right);
    close(g1.liveReduction!.areaT, hand.G1.areaT);
  });

  it("gives a column what arrives at its level and its base; a foundation what bears on it", () => {
    const c2 = all.get("C2")!;
    expect(c2.supports).toEqual([{ end: "base", mark: "F2", type: "foundation", x: null, at: null }]);
    expect(c2.loads.map((l) => [l.kind, l.origin, l.start])).toEqual([["reaction", { kind: "member", mark: "G1", type: "girder", end: "end" }, null]]);
    close(c2.reactions.D![0], hand.columns.C2.D);
    close(c2.reactions.L![0], hand.columns.C2.L);
    expect(c2.liveReduction!.floors).toBe(1);
    const f2 = all.get("F2")!;
    expect(f2.loads.map((l) => l.source)).toEqual(["C2 base"]);
    close(f2.reactions.D![0], hand.columns.C2.D);
    expect(f2.liveReduction).toBeNull();
  });

  it("lists every member of the takedown in takedown order, each after what it carries", () => {
    const order = [...all.keys()];
    expect(new Set(order)).toEqual(new Set(["B1", "B2", "G1", "G2", "C1", "C2", "C3", "C4", "F1", "F2", "F3", "F4"]));
    for (const [mark, rec] of all) {
      for (const l of rec.loads) if (l.origin.kind === "member") expect(order.indexOf(l.origin.mark), `${l.origin.mark} before ${mark}`).toBeLessThan(order.indexOf(mark));
    }
    expect(memberLoads(source, "nope")).toBeNull();
  });
});
