/**
 * Generates the sample buildings for the takedown builder: two invented buildings, each as a
 * workbook holding only the engineer's member tables (Zones, Members, Loads as Excel tables).
 * Run `loadpath takedown <file> -o out.xlsx` (or the task pane) on them to build the takedown.
 *
 *   npx tsx sample-workbooks/make-buildings.ts
 *
 * (a) steel-office-us.xlsx: a three-level steel office (two floors and a roof), US units. Column
 *     grid 1-3 x A-C (bays 30 ft in x, 25 ft in y); girders on the column lines span 25 ft in y;
 *     beams span 30 ft in x at the third points of the girders; spandrel beams on lines A and C
 *     carry the cladding; the edge girders on lines 1 and 3 run parallel to the deck and carry
 *     only cladding. On both floors a stair opening (x 20-30 ft, y 25-41.7 ft) interrupts the
 *     beam at y = 33.3 ft: it becomes a trimmed beam framing into a header at x = 20 ft, which
 *     bears on the two trimmer beams; the trimmers lose the deck on the opening side over the
 *     opening (Loads table, area from 0 to 20 ft). The stair's stringers bear on the header.
 *     Columns stack level by level onto footings. A file room on the second floor carries a
 *     non-reducible live load.
 * (b) timber-house-si.xlsx: a timber house in SI units: floor joists at 600 mm on two lines of
 *     bearers, cantilevering 1.2 m past the second line as a balcony (End overhang), bearers on
 *     posts; roof rafters on roof beams with a 0.6 m eave overhang, roof beams on roof posts that
 *     stand on the floor posts, posts on pad footings.
 * (c) two-storey-house-si.xlsx: a two-storey timber-frame house in SI units, 8.4 m by 6.0 m.
 *     Bearing walls on lines A (x = 0), B (x = 4.2 m, ground storey only) and C (x = 8.4 m).
 *     Floor joists at 600 mm span 8.4 m, continuous over the middle wall W1-B (a Bearings row
 *     each): two equal spans of 4.2 m. Roof trusses at 600 mm span 8.4 m from wall W2-A to line C.
 *     Upper-storey walls are stacked on the ground-storey walls (W2-A on W1-A, W2-C2 on W1-C),
 *     which stand on strip footings; on line C a 3.6 m garage opening below the first floor is
 *     bridged by beam B2-C on two posts, and the upper wall W2-C1 stands on that beam (Start at,
 *     End at), so the beam takes the wall's load as a line load. The walls' KLL cells are blank:
 *     their live load is not reduced.
 *
 * Every mark, dimension and load is invented for the demo.
 */
import { join } from "node:path";
import ExcelJS from "exceljs";

export type Cell = string | number | null;

/** One table of a sample workbook. */
export interface SampleTable {
  readonly sheet: string;
  readonly name: string;
  readonly headers: readonly string[];
  readonly rows: readonly (readonly Cell[])[];
}

/** Write tables as Excel tables, one per sheet, starting at A1. */
export async function writeWorkbook(path: string, tables: readonly SampleTable[], note: string): Promise<void> {
  const wb = new ExcelJS.Workbook();
  wb.creator = "Loadpath sample generator";
  for (const t of tables) {
    const ws = wb.addWorksheet(t.sheet);
    ws.addTable({
      name: t.name,
      ref: "A1",
      headerRow: true,
      style: { theme: "TableStyleLight9", showRowStripes: true },
      columns: t.headers.map((name) => ({ name, filterButton: true })),
      rows: t.rows.map((r) => t.headers.map((_, i) => r[i] ?? null)),
    });
    ws.columns.forEach((c) => (c.width = 14));
  }
  const about = wb.addWorksheet("About");
  about.getCell("A1").value = note;
  about.getCell("A2").value = "Invented building for the Loadpath demo. Results need review by a qualified engineer; local codes govern.";
  about.getColumn(1).width = 120;
  await wb.xlsx.writeFile(path);
}

const MEMBER_HEADERS_US = ["Mark", "Type", "Level", "Span (ft)", "Zone", "Trib (ft)", "Start support", "Start at (ft)", "End support", "End at (ft)", "KLL", "wD (plf)"];
const LOAD_HEADERS_US = ["Mark", "Kind", "Zone or case", "Magnitude (plf or lb)", "Width (ft)", "From (ft)", "To (ft)"];

/** (a) The three-level steel office, US units. */
export function steelOffice(): SampleTable[] {
  const xs = [0, 30, 60];
  const lines = ["1", "2", "3"];
  const rowsY = ["A", "B", "C"];
  const bayY = 25;
  const third = bayY / 3;
  const levels = [
    { name: "Roof", zone: "ROOF", opening: false },
    { name: "3", zone: "OFFICE", opening: true },
    { name: "2", zone: "OFFICE", opening: true },
  ];
  const members: Cell[][] = [];
  const loads: Cell[][] = [];
  const col = (x: number, y: number, level: string) => `C${lines[x]}${rowsY[y]}-${level}`;
  const girder = (x: number, y: number, level: string) => `${level}-G${lines[x]}${rowsY[y]}${rowsY[y + 1]}`;
  for (const lv of levels) {
    const L = lv.name;
    let n = 0;
    const beam = () => `${L}-B${String(++n).padStart(2, "0")}`;
    for (let bx = 0; bx < 2; bx++) {
      const x0 = lines[bx]!;
      const x1 = lines[bx + 1]!;
      // The file room: bay 2-3, A-B on the second floor.
      const zoneAB = L === "2" && bx === 1 ? "FILES" : lv.zone;
      const opening = lv.opening && bx === 0;
      // Spandrel on line A: half a beam spacing of deck plus the cladding.
      members.push([`${L}-S${x0}${x1}A`, "beam", L, 30, zoneAB, third / 2, col(bx, 0, L), null, col(bx + 1, 0, L), null, null, L === "Roof" ? 150 : 450]);
      for (const k of [1, 2]) members.push([beam(), "beam", L, 30, zoneAB, third, girder(bx, 0, L), k * third, girder(bx + 1, 0, L), k * third, null, 35]);
      // The beam on line B: deck on both sides; beside the opening it loses the north side from 20 ft.
      const lineB = beam();
      if (opening) {
        members.push([lineB, "beam", L, 30, lv.zone, third / 2, col(bx, 1, L), null, col(bx + 1, 1, L), null, null, 50]);
        loads.push([lineB, "area", lv.zone, null, third / 2, 0, 20]);
      } else {
        members.push([lineB, "beam", L, 30, lv.zone, third, col(bx, 1, L), null, col(bx + 1, 1, L), null, null, 50]);
      }
      if (opening) {
        // Trimmed beam at y = 33.3 ft: from girder 1BC to the header at x = 20 ft.
        const trimmed = `${L}-T1`;
        const header = `${L}-H1`;
        const upper = beam();
        members.push([trimmed, "beam", L, 20, lv.zone, third, girder(bx, 1, L), third, header, third, null, 35]);
        // Header at x = 20 ft, parallel to the deck: no deck, only the trimmed beam and the stair.
        members.push([header, "beam", L, 2 * third, null, null, lineB, 20, upper, 20, null, 40]);
        loads.push([header, "point", "D", 1800, null, 4, null], [header, "point", "L", 2400, null, 4, null]);
        // Beam at y = 41.7 ft: the other trimmer; deck on its south side only outside the opening.
        members.push([upper, "beam", L, 30, lv.zone, third / 2, girder(bx, 1, L), 2 * third, girder(bx + 1, 1, L), 2 * third, null, 50]);
        loads.push([upper, "area", lv.zone, null, third / 2, 0, 20]);
      } else {
        for (const k of [1, 2]) members.push([beam(), "beam", L, 30, lv.zone, third, girder(bx, 1, L), k * third, girder(bx + 1, 1, L), k * third, null, 35]);
      }
      members.push([`${L}-S${x0}${x1}C`, "beam", L, 30, lv.zone, third / 2, col(bx, 2, L), null, col(bx + 1, 2, L), null, null, L === "Roof" ? 150 : 450]);
    }
    // Girders on the column lines; the edge ones (lines 1 and 3) carry cladding only.
    for (let x = 0; x < 3; x++) {
      for (let y = 0; y < 2; y++) {
        const edge = x !== 1;
        members.push([girder(x, y, L), "girder", L, bayY, null, null, col(x, y, L), null, col(x, y + 1, L), null, null, edge ? (L === "Roof" ? 150 : 450) : 70]);
      }
    }
  }
  for (const [i, lv] of levels.entries()) {
    const below = levels[i + 1];
    for (let x = 0; x < 3; x++) {
      for (let y = 0; y < 3; y++) {
        const base = below ? col(x, y, below.name) : `F${lines[x]}${rowsY[y]}`;
        members.push([col(x, y, lv.name), "column", lv.name, 13, null, null, base, null, null, null, null, lv.name === "Roof" ? 40 : 60]);
      }
    }
  }
  for (let x = 0; x < 3; x++) for (let y = 0; y < 3; y++) members.push([`F${lines[x]}${rowsY[y]}`, "foundation", null, null, null, null, null, null, null, null, null, null]);
  return [
    {
      sheet: "Zones",
      name: "Zones",
      headers: ["Zone", "D (psf)", "L (psf)", "Lr (psf)", "S (psf)", "Reducible"],
      rows: [
        ["ROOF", 25, null, 20, 25, "no"],
        ["OFFICE", 70, 65, null, null, "yes"],
        ["FILES", 70, 125, null, null, "no"],
      ],
    },
    { sheet: "Members", name: "Members", headers: MEMBER_HEADERS_US, rows: members },
    { sheet: "Loads", name: "Loads", headers: LOAD_HEADERS_US, rows: loads },
  ];
}

/** (b) The timber house, SI units. */
export function timberHouse(): SampleTable[] {
  const members: Cell[][] = [];
  const loads: Cell[][] = [];
  const bearerSpan = 3.6;
  const joistSpan = 4.2;
  const balcony = 1.2;
  // Floor joists at 600 mm from y = 0.3 m to 6.9 m: on bearer line 1 (x = 0) and line 2 (x = 4.2 m).
  for (let i = 0; i < 12; i++) {
    const y = 0.3 + 0.6 * i;
    const half = y < bearerSpan ? "a" : "b";
    const at = y < bearerSpan ? y : y - bearerSpan;
    members.push([`J${String(i + 1).padStart(2, "0")}`, "joist", "1", joistSpan, null, null, `BR1${half}`, round(at), `BR2${half}`, round(at), null, 0.15, 0, balcony]);
    loads.push([`J${String(i + 1).padStart(2, "0")}`, "area", "FLOOR", null, 0.6, 0, joistSpan], [`J${String(i + 1).padStart(2, "0")}`, "area", "BALCONY", null, 0.6, joistSpan, joistSpan + balcony]);
  }
  // Bearers on posts; posts at y = 0, 3.6, 7.2 m on each line.
  for (const line of ["1", "2"]) {
    members.push([`BR${line}a`, "beam", "1", bearerSpan, null, null, `P${line}.1`, null, `P${line}.2`, null, null, 0.25, null, null]);
    members.push([`BR${line}b`, "beam", "1", bearerSpan, null, null, `P${line}.2`, null, `P${line}.3`, null, null, 0.25, null, null]);
  }
  // Roof rafters at 1.2 m on roof beams, with a 0.6 m eave past line 2.
  for (let i = 0; i < 6; i++) {
    const y = 0.6 + 1.2 * i;
    const half = y < bearerSpan ? "a" : "b";
    const at = y < bearerSpan ? y : y - bearerSpan;
    members.push([`R${i + 1}`, "joist", "Roof", joistSpan, "ROOF", 1.2, `RB1${half}`, round(at), `RB2${half}`, round(at), null, 0.12, 0, 0.6]);
  }
  for (const line of ["1", "2"]) {
    members.push([`RB${line}a`, "beam", "Roof", bearerSpan, null, null, `RP${line}.1`, null, `RP${line}.2`, null, null, 0.2, null, null]);
    members.push([`RB${line}b`, "beam", "Roof", bearerSpan, null, null, `RP${line}.2`, null, `RP${line}.3`, null, null, 0.2, null, null]);
  }
  for (const line of ["1", "2"]) for (const k of [1, 2, 3]) members.push([`RP${line}.${k}`, "post", "Roof", 2.7, null, null, `P${line}.${k}`, null, null, null, null, 0.15, null, null]);
  for (const line of ["1", "2"]) for (const k of [1, 2, 3]) members.push([`P${line}.${k}`, "post", "1", 2.4, null, null, `PF${line}.${k}`, null, null, null, null, 0.2, null, null]);
  for (const line of ["1", "2"]) for (const k of [1, 2, 3]) members.push([`PF${line}.${k}`, "foundation", null, null, null, null, null, null, null, null, null, null, null, null]);
  return [
    {
      sheet: "Zones",
      name: "Zones",
      headers: ["Zone", "D (kPa)", "L (kPa)", "Lr (kPa)", "S (kPa)", "Reducible"],
      rows: [
        ["FLOOR", 0.6, 1.9, null, null, "yes"],
        ["BALCONY", 0.6, 2.9, null, null, "no"],
        ["ROOF", 0.5, null, 0.96, 1.2, "no"],
      ],
    },
    {
      sheet: "Members",
      name: "Members",
      headers: ["Mark", "Type", "Level", "Span (m)", "Zone", "Trib (m)", "Start support", "Start at (m)", "End support", "End at (m)", "KLL", "wD (kN/m)", "Start overhang (m)", "End overhang (m)"],
      rows: members,
    },
    { sheet: "Loads", name: "Loads", headers: ["Mark", "Kind", "Zone or case", "Magnitude (kN/m or kN)", "Width (m)", "From (m)", "To (m)"], rows: loads },
  ];
}

/** Layout of sample (c), shared with its tests (test/cli/sample-two-storey.test.ts). */
export const TWO_STOREY = {
  /** Joist and truss spacing (m); the first at half a spacing from the end wall. */
  spacing: 0.6,
  /** Bay between wall lines A-B and B-C (m): the continuous joists' two equal spans. */
  bay: 4.2,
  /** Length of the walls on lines A and B (m). */
  wallLength: 6.0,
  /** The garage opening on line C, bridged by beam B2-C (m from the house's end, y = 0). */
  opening: 3.6,
  /** Own weight of every stud wall, kN per metre of wall (wD). */
  wallWeight: 1.35,
} as const;

/** (c) The two-storey timber-frame house, SI units. */
export function twoStoreyHouse(): SampleTable[] {
  const { spacing, bay, wallLength, opening, wallWeight } = TWO_STOREY;
  const members: Cell[][] = [];
  const bearings: Cell[][] = [];
  const count = Math.round(wallLength / spacing);
  for (let i = 0; i < count; i++) {
    const y = round(spacing / 2 + spacing * i);
    const overOpening = y < opening;
    // Roof trusses: from the upper wall on line A to the upper wall on line C (on the beam over the opening, or on the wall stacked on W1-C).
    members.push([`RT${i + 1}`, "joist", "Roof", 2 * bay, "ROOF", spacing, "W2-A", null, overOpening ? "W2-C1" : "W2-C2", null, null, 0.05]);
    // Floor joists, continuous over W1-B: on line C they bear on beam B2-C at y, or on wall W1-C.
    const joist = `FJ${i + 1}`;
    members.push([joist, "joist", "2", 2 * bay, "FLOOR", spacing, "W1-A", null, overOpening ? "B2-C" : "W1-C", overOpening ? y : null, null, 0.08]);
    bearings.push([joist, "W1-B", bay, null]);
  }
  members.push(
    ["W2-A", "wall", "2", wallLength, null, null, "W1-A", null, null, null, null, wallWeight],
    ["W2-C1", "wall", "2", null, null, null, "B2-C", 0, null, opening, null, wallWeight],
    ["W2-C2", "wall", "2", round(wallLength - opening), null, null, "W1-C", null, null, null, null, wallWeight],
    ["B2-C", "beam", "2", opening, null, null, "PC1", null, "PC2", null, null, 0.3],
    ["W1-A", "wall", "1", wallLength, null, null, "SF-A", null, null, null, null, wallWeight],
    ["W1-B", "wall", "1", wallLength, null, null, "SF-B", null, null, null, null, wallWeight],
    ["W1-C", "wall", "1", round(wallLength - opening), null, null, "SF-C", null, null, null, null, wallWeight],
    ["PC1", "post", "1", 2.7, null, null, "FC1", null, null, null, null, 0.15],
    ["PC2", "post", "1", 2.7, null, null, "FC2", null, null, null, null, 0.15],
  );
  for (const f of ["SF-A", "SF-B", "SF-C", "FC1", "FC2"]) members.push([f, "foundation", null, null, null, null, null, null, null, null, null, null]);
  return [
    {
      sheet: "Zones",
      name: "Zones",
      headers: ["Zone", "D (kPa)", "L (kPa)", "Lr (kPa)", "S (kPa)", "Reducible"],
      rows: [
        ["ROOF", 0.85, null, 0.96, 1.0, "no"],
        ["FLOOR", 0.7, 1.9, null, null, "yes"],
      ],
    },
    {
      sheet: "Members",
      name: "Members",
      headers: ["Mark", "Type", "Level", "Span (m)", "Zone", "Trib (m)", "Start support", "Start at (m)", "End support", "End at (m)", "KLL", "wD (kN/m)"],
      rows: members,
    },
    { sheet: "Bearings", name: "Bearings", headers: ["Mark", "Support", "At (m)", "Support at (m)"], rows: bearings },
  ];
}

function round(x: number): number {
  return Math.round(x * 1000) / 1000;
}

async function main(): Promise<void> {
  const dir = __dirname;
  await writeWorkbook(join(dir, "steel-office-us.xlsx"), steelOffice(), "Sample (a): three-level steel office, US units (ft, psf, plf, lb). Run: loadpath takedown steel-office-us.xlsx -o out.xlsx");
  await writeWorkbook(join(dir, "timber-house-si.xlsx"), timberHouse(), "Sample (b): timber house, SI units (m, kPa, kN/m, kN). Run: loadpath takedown timber-house-si.xlsx -o out.xlsx --units SI");
  await writeWorkbook(
    join(dir, "two-storey-house-si.xlsx"),
    twoStoreyHouse(),
    "Sample (c): two-storey timber-frame house, SI units (m, kPa, kN/m, kN): floor joists continuous over a middle bearing wall, upper walls stacked on lower walls and, over a garage opening, standing on a beam. Run: loadpath takedown two-storey-house-si.xlsx -o out.xlsx --units SI",
  );
  console.log("wrote sample-workbooks/steel-office-us.xlsx, sample-workbooks/timber-house-si.xlsx and sample-workbooks/two-storey-house-si.xlsx");
}

if (require.main === module) {
  main().catch((e: unknown) => {
    console.error(e);
    process.exit(1);
  });
}
