/**
 * Property (fast-check) over random malformed takedown tables: any cell of the Members, Zones and
 * Loads tables may be a number, blank, a number stored as text, other text, an error value, a
 * date serial, a huge or a negative number. Whatever the tables, a build is never both silent and
 * wrong: either a problem is listed, or the generated sheet holds no error value and the JSON no
 * non-finite number; and an error cell on the generated sheet always comes with an errorResult
 * problem naming a cell of that sheet. Both the add-in and the hand-off version are built.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import type { RawCellContent } from "hyperformula";
import { badNumbers, buildOn, errorCells, jsonOf } from "./helpers";

/** A number cell as a CSV import or a careless edit leaves it. */
const numberCell: fc.Arbitrary<RawCellContent> = fc.oneof(
  { weight: 6, arbitrary: fc.integer({ min: 1, max: 40 }) },
  { weight: 1, arbitrary: fc.constant(null) },
  { weight: 1, arbitrary: fc.integer({ min: 1, max: 40 }).map((n) => `' ${n} `) },
  { weight: 1, arbitrary: fc.constantFrom("'1,200", "'wide", "'12 ft", "'", "TRUE") },
  { weight: 1, arbitrary: fc.constantFrom("=NA()", "=1/0", "=SQRT(-1)") },
  { weight: 1, arbitrary: fc.constantFrom(45293, 45293.5) },
  { weight: 1, arbitrary: fc.constantFrom(1e200, 1e300, -5, 0, -0.5) },
);

/** A name cell (mark, support, zone, level, type). */
function nameCell(names: readonly string[]): fc.Arbitrary<RawCellContent> {
  return fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...names) }, { weight: 1, arbitrary: fc.constantFrom(null, "=NA()", 45293, "'12") });
}

const MARKS = ["B1", "B2", "B3", "G1", "W1", "__proto__"];
const HEADERS = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "KLL", "wD (plf)", "End overhang (ft)"];

const beamRow = (mark: string): fc.Arbitrary<RawCellContent[]> =>
  fc.tuple(
    nameCell([mark]),
    nameCell(["beam", "joist", "beam"]),
    nameCell(["2", "Roof"]),
    numberCell,
    nameCell(["OFF", "ROOF"]),
    numberCell,
    nameCell(["G1", "W1"]),
    numberCell,
    nameCell(["G1", "W1"]),
    numberCell,
    fc.oneof(fc.constant(null), numberCell),
    fc.oneof(fc.constant(null), numberCell),
    fc.oneof({ weight: 3, arbitrary: fc.constant(null) }, { weight: 1, arbitrary: numberCell }),
  );

const tables = fc.record({
  beams: fc.tuple(beamRow("B1"), beamRow("B2"), beamRow("__proto__")),
  girderSpan: numberCell,
  zones: fc.tuple(numberCell, numberCell, numberCell, fc.constantFrom("yes", "no", "=NA()", "maybe")),
  loads: fc.array(fc.tuple(nameCell(MARKS), fc.constantFrom("point", "line", "area", "=NA()"), nameCell(["D", "L", "OFF", "constructor"]), numberCell, numberCell, numberCell, numberCell), { maxLength: 2 }),
  native: fc.boolean(),
});

describe("random malformed tables", () => {
  it("either a listed problem or finite results: never both silent and wrong", async () => {
    await fc.assert(
      fc.asyncProperty(tables, async (t) => {
        const sheets: Record<string, RawCellContent[][]> = {
          Zones: [
            ["Zone", "D (psf)", "L (psf)", "Reducible"],
            ["OFF", t.zones[0], t.zones[1], t.zones[3]],
            ["ROOF", t.zones[2], null, "no"],
          ],
          Members: [HEADERS, ...t.beams, ["G1", "girder", "2", t.girderSpan, null, null, "W1", null, "W1", null, null, null, null], ["W1", "wall"]],
          ...(t.loads.length > 0 ? { Loads: [["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"], ...t.loads] } : {}),
        };
        const built = await buildOn(sheets, { native: t.native });
        const errors = errorCells(built);
        const bad = badNumbers(jsonOf(built));
        if (built.result.problems.length === 0) {
          expect(errors).toEqual([]);
          expect(bad).toEqual([]);
        }
        if (errors.length > 0) expect(built.result.problems.filter((p) => p.code === "errorResult" && (p.sheet === "Takedown" || p.sheet === "Takedown extremes")).length).toBeGreaterThan(0);
        if (bad.length > 0) expect(built.result.problems.some((p) => p.code === "errorResult")).toBe(true);
      }),
      { numRuns: 150, seed: 20261204 },
    );
  }, 120_000);
});
