/**
 * Generates plan-office-us.xlsx: the invented three-level steel office of steel-office-us.xlsx
 * described as a framing plan instead of typed member tables. Grids 1-3 (x = 0, 30, 60 ft) and
 * A-C (y = 0, 25, 50 ft); Levels 1 (ground), 2, 3 and Roof 13 ft apart; Framing rows by
 * coordinates (grid names where a member lies on a grid, numbers at the girders' third points);
 * one-way decks spanning y, with the stair opening (x 20-30 ft, y 25-41.7 ft) on levels 2 and 3
 * and the file room's deck on level 2 (x 30-60 ft, up to mid-way between the last beam and
 * line B); a Loads table with the stair's point loads on the header, which no plan gives.
 * `loadpath takedown plan-office-us.xlsx` derives the members, their supports and tributary
 * loads onto the sheets "Plan members", "Plan loads" and "Plan bearings" and builds the same
 * takedown as the typed sample (test/cli/plan-office.test.ts compares every result).
 *
 *   npx tsx sample-workbooks/make-plan-office.ts
 *
 * Every mark, dimension and load is invented for the demo.
 */
import { join } from "node:path";
import { steelOffice, writeWorkbook, type Cell, type SampleTable } from "./make-buildings";


const X: Readonly<Record<string, number>> = { "1": 0, "2": 30, "3": 60 };
const Y: Readonly<Record<string, number>> = { A: 0, B: 25, C: 50 };

/** A point of the plan and, where it lies on grids, their names. */
interface At {
  readonly x: number;
  readonly y: number;
}

/** X cell: the grid name when the point is on an X grid, else the number. */
function xCell(x: number): Cell {
  return Object.entries(X).find(([, v]) => Math.abs(v - x) < 1e-12)?.[0] ?? x;
}

function yCell(y: number): Cell {
  return Object.entries(Y).find(([, v]) => Math.abs(v - y) < 1e-12)?.[0] ?? y;
}

/**
 * The plan tables of the office, from the typed sample's own member rows: each member's ends are
 * placed where its typed supports put them (a column's grid point; a point at Start at / End at
 * along a supporting member), so the plan describes the same building.
 */
export function planOffice(): SampleTable[] {
  const typed = steelOffice();
  const zones = typed.find((t) => t.name === "Zones")!;
  const members = typed.find((t) => t.name === "Members")!.rows;
  const loads = typed.find((t) => t.name === "Loads")!.rows;
  const h = typed.find((t) => t.name === "Members")!.headers;
  const c = (name: string): number => h.indexOf(name);
  const [iMark, iType, iLevel, iStart, iStartAt, iEnd, iEndAt, iKll, iWd] = ["Mark", "Type", "Level", "Start support", "Start at (ft)", "End support", "End at (ft)", "KLL", "wD (plf)"].map(c) as number[];
  const points = new Map<string, At>();
  const ends = new Map<string, [At, At]>();
  // Columns C<line><row>-<level> and footings F<line><row> stand at grid intersections.
  for (const r of members) {
    const mark = String(r[iMark!]);
    const m = /^[CF]([123])([ABC])/.exec(mark);
    if (m && (r[iType!] === "column" || r[iType!] === "foundation")) points.set(mark, { x: X[m[1]!]!, y: Y[m[2]!]! });
  }
  const where = (support: Cell, at: Cell): At | undefined => {
    const p = points.get(String(support));
    if (p) return p;
    const e = ends.get(String(support));
    if (!e || typeof at !== "number") return undefined;
    const [a, b] = e;
    const len = Math.hypot(b.x - a.x, b.y - a.y);
    return { x: a.x + ((b.x - a.x) * at) / len, y: a.y + ((b.y - a.y) * at) / len };
  };
  // Spanning members: resolved once what they bear on is placed (a header bears on beams listed after it).
  const spanning = members.filter((r) => !["column", "foundation"].includes(String(r[iType!])));
  for (let pass = 0; pass < 5 && ends.size < spanning.length; pass++) {
    for (const r of spanning) {
      const mark = String(r[iMark!]);
      if (ends.has(mark)) continue;
      const a = where(r[iStart!]!, r[iStartAt!] ?? null);
      const b = where(r[iEnd!]!, r[iEndAt!] ?? null);
      if (a && b) ends.set(mark, [a, b]);
    }
  }
  if (ends.size !== spanning.length) throw new Error("plan office: a member could not be placed");
  const framing: Cell[][] = members.map((r) => {
    const mark = String(r[iMark!]);
    const type = String(r[iType!]);
    const level = type === "foundation" ? "1" : String(r[iLevel!]);
    const extra = [r[iKll!] ?? null, r[iWd!] ?? null];
    if (type === "column" || type === "foundation") {
      const p = points.get(mark)!;
      return [mark, type, level, xCell(p.x), yCell(p.y), null, null, ...extra];
    }
    const [a, b] = ends.get(mark)!;
    return [mark, type, level, xCell(a.x), yCell(a.y), xCell(b.x), yCell(b.y), ...extra];
  });
  const third = 25 / 3;
  const decks: Cell[][] = [
    ["ROOF-1", "Roof", "one-way", "ROOF", "y", "1", "A", "3", "C", null],
    ["L3-1", "3", "one-way", "OFFICE", "y", "1", "A", "3", "C", null],
    ["L3-STAIR", "3", "opening", null, null, 20, "B", "2", 2 * third + 25, null],
    ["L2-W", "2", "one-way", "OFFICE", "y", "1", "A", "2", "C", null],
    // the file room's deck reaches mid-way between the beam at 16.7 ft and line B (the typed sample's strip)
    ["L2-FILES", "2", "one-way", "FILES", "y", "2", "A", "3", 25 - third / 2, null],
    ["L2-E", "2", "one-way", "OFFICE", "y", "2", 25 - third / 2, "3", "C", null],
    ["L2-STAIR", "2", "opening", null, null, 20, "B", "2", 2 * third + 25, null],
  ];
  // Only the loads the plan cannot give: the stair's point loads on the headers.
  const userLoads = loads.filter((r) => r[1] === "point");
  return [
    { sheet: "Zones", name: "Zones", headers: zones.headers, rows: zones.rows },
    { sheet: "Grids", name: "Grids", headers: ["Grid", "X (ft)", "Y (ft)"], rows: [...Object.entries(X).map(([g, x]) => [g, x, null]), ...Object.entries(Y).map(([g, y]) => [g, null, y])] },
    { sheet: "Levels", name: "Levels", headers: ["Level", "Elevation (ft)"], rows: [["1", 0], ["2", 13], ["3", 26], ["Roof", 39]] },
    { sheet: "Framing", name: "Framing", headers: ["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2", "KLL", "wD (plf)"], rows: framing },
    { sheet: "Decks", name: "Decks", headers: ["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2", "Corners"], rows: decks },
    { sheet: "Loads", name: "Loads", headers: ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"], rows: userLoads },
  ];
}

/** Write tables as Excel tables, one per sheet, starting at A1 (the typed samples' writer). */
export const writePlanWorkbook = writeWorkbook;

async function main(): Promise<void> {
  await writePlanWorkbook(
    join(__dirname, "plan-office-us.xlsx"),
    planOffice(),
    "Sample (c): the three-level steel office of sample (a) as a framing plan, US units (ft, psf, plf, lb). Run: loadpath takedown plan-office-us.xlsx -o out.xlsx",
  );
  console.log("wrote sample-workbooks/plan-office-us.xlsx");
}

if (require.main === module) {
  main().catch((e: unknown) => {
    console.error(e);
    process.exit(1);
  });
}
