/**
 * Generates plan-studio-si.xlsx: an invented two-level studio building in SI units, described
 * only as a framing plan (no Members table), to show every rule of the derivation:
 *
 * - grids 1-3 (x = 0, 8, 16 m) and A-C (y = 0, 6, 12 m); levels 1 (ground, 0 m), 2 (3.5 m) and
 *   Roof (7 m); columns on every grid point of level 2, standing on foundations the derivation
 *   adds (F-<column>);
 * - a deck direction change: the west bay (x 0-8 m) spans x onto the girders on lines 1 and 2;
 *   the south-east bay (x 8-16, y 0-6 m) spans y onto joists;
 * - a slab overhang: a balcony deck 1.5 m wide west of line 1 (zone BALCONY), carried by the
 *   girders on line 1;
 * - an opening in the west bay (x 2-4 m, y 8-10 m);
 * - a skewed joist J2 from (8, 4) to (16, 3.5) m: the deck widths beside it vary along it;
 * - a two-way panel (x 8-16, y 6-12 m) bounded by beams and girders on all four sides;
 * - a roof over the west bay whose middle beam is continuous over a roof column C4B-R at (4, 6) m
 *   that stands on the level 2 beam BB1 (a transfer).
 *
 *   npx tsx sample-workbooks/make-plan-studio.ts
 *
 * Every mark, dimension and load is invented for the demo.
 */
import { join } from "node:path";
import { writePlanWorkbook } from "./make-plan-office";

type Cell = string | number | null;

/** The plan tables of the studio. */
export function planStudio(): { sheet: string; name: string; headers: string[]; rows: Cell[][] }[] {
  const framing: Cell[][] = [];
  // level 2 columns on every grid point
  for (const x of ["1", "2", "3"]) for (const y of ["A", "B", "C"]) framing.push([`C${x}${y}-2`, "column", "2", x, y, null, null]);
  // girders along the x grids, from A to B and from B to C
  for (const x of ["1", "2", "3"]) {
    framing.push([`G${x}AB`, "girder", "2", x, "A", x, "B"]);
    framing.push([`G${x}BC`, "girder", "2", x, "B", x, "C"]);
  }
  // beams along the y grids, bay by bay
  for (const y of ["A", "B", "C"]) {
    framing.push([`B${y}1`, "beam", "2", "1", y, "2", y]);
    framing.push([`B${y}2`, "beam", "2", "2", y, "3", y]);
  }
  // joists of the south-east bay, one of them skewed
  framing.push(["J1", "joist", "2", "2", "A+2", "3", "A+2"]);
  framing.push(["J2", "joist", "2", "2", "A+4", "3", "A+3.5"]);
  // the roof over the west bay
  for (const [mark, x, y] of [["C1A-R", "1", "A"], ["C2A-R", "2", "A"], ["C1C-R", "1", "C"], ["C2C-R", "2", "C"], ["C4B-R", 4, "B"]] as const) framing.push([mark, "column", "Roof", x, y, null, null]);
  framing.push(["RG1", "girder", "Roof", "1", "A", "1", "C"]);
  framing.push(["RG2", "girder", "Roof", "2", "A", "2", "C"]);
  framing.push(["RBA", "beam", "Roof", "1", "A", "2", "A"]);
  framing.push(["RBB", "beam", "Roof", "1", "B", "2", "B"]);
  framing.push(["RBC", "beam", "Roof", "1", "C", "2", "C"]);
  const decks: Cell[][] = [
    ["W", "2", "one-way", "FLOOR", "x", "1", "A", "2", "C", null],
    ["BALC", "2", "one-way", "BALCONY", "x", "1-1.5", "A", "1", "C", null],
    ["W-OPEN", "2", "opening", null, null, 2, 8, 4, 10, null],
    ["SE", "2", "one-way", "FLOOR", "y", "2", "A", "3", "B", null],
    ["NE", "2", "two-way", "FLOOR", null, null, null, null, null, "2/B; 3/B; 3/C; 2/C"],
    ["ROOF", "Roof", "one-way", "ROOF", 90, "1", "A", "2", "C", null],
  ];
  return [
    {
      sheet: "Zones",
      name: "Zones",
      headers: ["Zone", "D (kPa)", "L (kPa)", "Lr (kPa)", "S (kPa)", "Reducible"],
      rows: [
        ["FLOOR", 3.0, 2.4, null, null, "yes"],
        ["BALCONY", 3.5, 4.8, null, null, "no"],
        ["ROOF", 1.2, null, 1.0, 1.5, "no"],
      ],
    },
    {
      sheet: "Grids",
      name: "Grids",
      headers: ["Grid", "X (m)", "Y (m)"],
      rows: [["1", 0, null], ["2", 8, null], ["3", 16, null], ["A", null, 0], ["B", null, 6], ["C", null, 12]],
    },
    { sheet: "Levels", name: "Levels", headers: ["Level", "Elevation (m)"], rows: [["1", 0], ["2", 3.5], ["Roof", 7]] },
    { sheet: "Framing", name: "Framing", headers: ["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2"], rows: framing },
    { sheet: "Decks", name: "Decks", headers: ["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2", "Corners"], rows: decks },
  ];
}

async function main(): Promise<void> {
  await writePlanWorkbook(
    join(__dirname, "plan-studio-si.xlsx"),
    planStudio(),
    "Sample (d): an invented two-level studio as a framing plan, SI units (m, kPa). Run: loadpath takedown plan-studio-si.xlsx -o out.xlsx",
  );
  console.log("wrote sample-workbooks/plan-studio-si.xlsx");
}

if (require.main === module) {
  main().catch((e: unknown) => {
    console.error(e);
    process.exit(1);
  });
}
