/**
 * A member table of about 2,000 members (an invented multi-storey frame) builds without a problem,
 * and its load balance closes: the total applied load, summed here row by row from the tables,
 * equals the footing reactions to 1e-9 relative. Needs `npm run build`.
 */
import { describe, expect, it } from "vitest";
import { frameOfSize, makeFrame } from "./takedown-fixtures";
import { buildOn } from "./takedown-helpers";

describe("a 2,000-member takedown", () => {
  it("builds, orders every member and balances", async () => {
    const size = frameOfSize(2000);
    const frame = makeFrame(size);
    expect(frame.memberCount).toBeGreaterThanOrEqual(2000);
    const { result } = await buildOn(frame.sheets);
    expect(result.problems).toEqual([]);
    expect(result.ok).toBe(true);
    const counted = Object.values(result.summary!.membersByType).reduce((a, b) => a + b, 0);
    expect(counted).toBe(frame.memberCount);
    expect(result.summary!.levels[0]).toBe("Roof");
    // Applied load by hand, row by row: (zone load x trib + wD) x span for beams and girders,
    // wD x height for columns (psf x ft = plf; /1000 = kip).
    const zones = new Map(frame.sheets.Zones!.slice(1).map((r) => [r[0], { D: Number(r[1] ?? 0), L: Number(r[2] ?? 0) }]));
    let appliedD = 0;
    let appliedL = 0;
    for (const r of frame.sheets.Members!.slice(1)) {
      const [, type, , span, zone, trib, , , , , , wD] = r as [string, string, string, number, string, number, ...unknown[]];
      const z = zones.get(zone) ?? { D: 0, L: 0 };
      if (type === "beam" || type === "girder") {
        appliedD += ((z.D * Number(trib ?? 0) + Number(wD ?? 0)) * span) / 1000;
        appliedL += (z.L * Number(trib ?? 0) * span) / 1000;
      } else if (type === "column") appliedD += (Number(wD) * span) / 1000;
    }
    const b = result.json!.balance;
    expect(Math.abs(b.D!.applied - appliedD)).toBeLessThanOrEqual(1e-9 * appliedD);
    expect(Math.abs(b.L!.applied - appliedL)).toBeLessThanOrEqual(1e-9 * appliedL);
    expect(Math.abs(b.D!.supports - appliedD)).toBeLessThanOrEqual(1e-9 * appliedD);
    expect(Math.abs(b.L!.supports - appliedL)).toBeLessThanOrEqual(1e-9 * appliedL);
    // Every column of the bottom storey supports every floor of office live load (the roof carries Lr and S).
    const bottom = Object.entries(result.json!.columns).filter(([mark]) => mark.endsWith("-L1"));
    expect(bottom).toHaveLength((size.bays + 1) ** 2);
    for (const [, c] of bottom) expect(c.floors).toBe(size.levels - 1);
  });
});
