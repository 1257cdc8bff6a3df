/**
 * Generates sample-workbooks/beam-schedule.xlsx: an invented member schedule (marks, spans,
 * loads and sections are made up for the demo) that uses the LOADPATH beam functions, with the
 * results computed headless and cached in the file so it reads correctly without the add-in. Its
 * "Gravity loads" sheet (./gravity-loads.ts) derives line loads, reduced live loads and a column's
 * load combinations with the LOADPATH load functions; members F-203 and F-204 take their line
 * loads from it. The output is byte for byte the same on every run (fixed dates in the package).
 *
 *   npm run build && npx tsx sample-workbooks/make-beam-schedule.ts
 *
 * Units: kip-ft (spans ft, line loads kip/ft, point loads kip, E ksi, I in^4, deflection in).
 */
import { writeFileSync } from "node:fs";
import { join } from "node:path";
import ExcelJS from "exceljs";
import JSZip from "jszip";
import { cacheResults, evaluateWorkbook, fromExcelJs } from "../src/workbook/xlsx";
import { GRAVITY_SHEET, gravityRef, writeGravityLoadsSheet } from "./gravity-loads";

/** Date stamped in the document properties and on every part of the package, so reruns are identical. */
const FIXED_DATE = new Date(Date.UTC(2025, 0, 1));

/** One load row: kind | magnitude | start | end | end magnitude (a string starting with "=" is a formula). */
type LoadRow = readonly [string, number | string, number | string | null, number | string | null, number | null];
/** One support row: position | type. */
type SupportRow = readonly [number | string, string];

interface Member {
  readonly mark: string;
  readonly description: string;
  readonly spanFt: number;
  readonly eKsi: number;
  readonly iIn4: number;
  /** Deflection limit as span / limit. */
  readonly limit: number;
  readonly loads: readonly LoadRow[];
  /** Left out: pins at both ends (the functions' default). */
  readonly supports?: readonly SupportRow[];
}

/** Rows reserved per member on the Loads sheet (blank rows are skipped by the functions). */
const LOAD_ROWS = 5;
const SUPPORT_ROWS = 3;

/** The invented schedule. Row of each member on the Beams sheet = index + 2. */
const MEMBERS: readonly Member[] = [
  { mark: "R-101", description: "Roof beam, uniform load", spanFt: 24, eKsi: 29000, iIn4: 448, limit: 240, loads: [["line", 0.95, null, null, null]] },
  {
    mark: "F-201",
    description: "Floor beam, partition strip over the middle third",
    spanFt: 30,
    eKsi: 29000,
    iIn4: 882,
    limit: 360,
    loads: [
      ["line", 0.85, null, null, null],
      ["line", 1.2, 10, 20, null],
    ],
    supports: [
      [0, "pin"],
      [30, "roller"],
    ],
  },
  {
    mark: "F-202",
    description: "Floor beam with a 6 ft balcony overhang, edge load at the tip",
    spanFt: 28,
    eKsi: 29000,
    iIn4: 984,
    limit: 360,
    loads: [
      ["line", 1.0, null, null, null],
      ["point", 6.0, 28, null, null],
    ],
    supports: [
      [0, "pin"],
      [22, "roller"],
    ],
  },
  {
    mark: "G-301",
    description: "Girder carrying two beams at third points (positions follow the span)",
    spanFt: 32,
    eKsi: 29000,
    iIn4: 2370,
    limit: 360,
    loads: [
      ["point", 18.4, "=Beams!B5/3", null, null],
      ["point", 18.4, "=2*Beams!B5/3", null, null],
      ["line", 0.12, null, null, null],
    ],
  },
  {
    mark: "C-401",
    description: "Two-span continuous beam, 2 x 20 ft",
    spanFt: 40,
    eKsi: 29000,
    iIn4: 800,
    limit: 360,
    loads: [["line", 1.4, null, null, null]],
    supports: [
      [0, "pin"],
      [20, "pin"],
      [40, "pin"],
    ],
  },
  {
    mark: "K-501",
    description: "Cantilever canopy beam, tapering load and an edge point load",
    spanFt: 8,
    eKsi: 29000,
    iIn4: 350,
    limit: 180,
    loads: [
      ["line", 0.6, 0, 8, 0.3],
      ["point", 2.0, 8, null, null],
    ],
    supports: [[0, "fixed"]],
  },
  {
    mark: "F-203",
    description: "Interior floor beam, dead and live line loads from the Gravity loads sheet",
    spanFt: 28,
    eKsi: 29000,
    iIn4: 640,
    limit: 360,
    loads: [
      ["line", `=${gravityRef("wdInt")}`, null, null, null],
      ["line", `=${gravityRef("wlInt")}`, null, null, null],
    ],
  },
  {
    mark: "F-204",
    description: "Edge floor beam (slab overhang, cladding), line loads from the Gravity loads sheet",
    spanFt: 28,
    eKsi: 29000,
    iIn4: 590,
    limit: 360,
    loads: [
      ["line", `=${gravityRef("wdEdge")}`, null, null, null],
      ["line", `=${gravityRef("wlEdge")}`, null, null, null],
    ],
  },
];

const BEAM_HEADERS = [
  "Mark",
  "Span (ft)",
  "E (ksi)",
  "I (in^4)",
  "Limit (L/)",
  "R1 (kip)",
  "R2 (kip)",
  "R3 (kip)",
  "Mmax (kip-ft)",
  "Mmin (kip-ft)",
  "Vmax (kip)",
  "Deflection (in)",
  "L/deflection",
  "I required (in^4)",
  "Check",
  "Description",
];

/** First row (1-based) of a member's block on the Loads sheet. */
function blockRow(index: number): number {
  return 2 + index * LOAD_ROWS;
}

function cellContent(v: number | string | null): ExcelJS.CellValue {
  return typeof v === "string" && v.startsWith("=") ? { formula: v.slice(1) } : v;
}

function loadsRef(index: number): string {
  const r = blockRow(index);
  return `Loads!$B$${r}:$F$${r + LOAD_ROWS - 1}`;
}

function supportsRef(index: number): string {
  const r = blockRow(index);
  return `Loads!$H$${r}:$I$${r + SUPPORT_ROWS - 1}`;
}

function writeLoadsSheet(ws: ExcelJS.Worksheet): void {
  ws.addRow(["Mark", "Kind", "Magnitude (kip/ft, kip)", "Start (ft)", "End (ft)", "End magnitude", "", "Support at (ft)", "Type"]).font = { bold: true };
  MEMBERS.forEach((m, i) => {
    const r = blockRow(i);
    ws.getCell(r, 1).value = m.mark;
    m.loads.forEach((load, k) => load.forEach((v, c) => (ws.getCell(r + k, 2 + c).value = cellContent(v))));
    (m.supports ?? []).forEach((s, k) => s.forEach((v, c) => (ws.getCell(r + k, 8 + c).value = cellContent(v))));
  });
  ws.columns.forEach((col, i) => (col.width = [8, 8, 22, 10, 10, 14, 3, 15, 8][i] ?? 10));
}

function writeBeamsSheet(ws: ExcelJS.Worksheet): void {
  ws.addRow(BEAM_HEADERS).font = { bold: true };
  MEMBERS.forEach((m, i) => {
    const r = i + 2;
    const member = `B${r},${loadsRef(i)}`;
    const sup = m.supports ? `,${supportsRef(i)}` : "";
    ws.getRow(r).values = [m.mark, m.spanFt, m.eKsi, m.iIn4, m.limit];
    ws.getCell(`F${r}`).value = { formula: `LOADPATH.REACTIONS(${member}${sup})` };
    ws.getCell(`I${r}`).value = { formula: `LOADPATH.MOMENT_MAX(${member}${sup})` };
    ws.getCell(`J${r}`).value = { formula: `LOADPATH.MOMENT_MIN(${member}${sup})` };
    ws.getCell(`K${r}`).value = { formula: `LOADPATH.SHEAR_MAX(${member}${sup})` };
    ws.getCell(`L${r}`).value = { formula: `LOADPATH.DEFLECTION_MAX(${member},C${r},D${r},"kip-ft"${sup})` };
    // Governing length/deflection of the parts: each span between supports over its own length,
    // an overhang over twice its length (the rule REQUIRED_I follows): deflection scales as 1/I, so
    // at I it is the limit ratio times I / I required.
    ws.getCell(`M${r}`).value = { formula: `IF(N${r}>0,E${r}*D${r}/N${r},"")` };
    ws.getCell(`N${r}`).value = { formula: `LOADPATH.REQUIRED_I(${member},C${r},E${r},"kip-ft"${sup})` };
    ws.getCell(`O${r}`).value = { formula: `IF(D${r}>=N${r},"OK","REVIEW")` };
    ws.getCell(`P${r}`).value = m.description;
  });
  ws.columns.forEach((col, i) => {
    col.width = i === 15 ? 62 : i === 0 ? 8 : 12;
    if (i >= 5 && i <= 13) col.numFmt = i === 12 ? "0" : "0.00";
  });
  const note = MEMBERS.length + 3;
  ws.getCell(`A${note}`).value =
    "Invented demo schedule. Results are for review by a qualified engineer; local codes govern. Units: ft, kip/ft, kip, ksi, in^4, in.";
}

function writeDiagramSheet(ws: ExcelJS.Worksheet): void {
  const i = MEMBERS.findIndex((m) => m.mark === "F-202");
  ws.getCell("A1").value = `Shear and moment of ${MEMBERS[i]!.mark} (x ft, V kip, M kip-ft), for a chart`;
  ws.getRow(2).values = ["x (ft)", "V (kip)", "M (kip-ft)"];
  ws.getRow(2).font = { bold: true };
  ws.getCell("A3").value = { formula: `LOADPATH.DIAGRAM(Beams!B${i + 2},${loadsRef(i)},${supportsRef(i)},14)` };
  ws.getCell("E2").value = "Reaction at the roller (kip)";
  ws.getCell("F2").value = { formula: `LOADPATH.REACTION(Beams!B${i + 2},${loadsRef(i)},2,${supportsRef(i)})` };
  ws.getCell("E3").value = "Moment over the roller (kip-ft)";
  ws.getCell("F3").value = { formula: `LOADPATH.MOMENT_AT(Beams!B${i + 2},${loadsRef(i)},22,${supportsRef(i)})` };
  ws.getCell("E4").value = "Shear just right of the roller (kip)";
  ws.getCell("F4").value = { formula: `LOADPATH.SHEAR_AT(Beams!B${i + 2},${loadsRef(i)},22,${supportsRef(i)})` };
  ws.getCell("E5").value = "Tip deflection (in)";
  ws.getCell("F5").value = { formula: `LOADPATH.DEFLECTION_AT(Beams!B${i + 2},${loadsRef(i)},Beams!C${i + 2},Beams!D${i + 2},"kip-ft",28,${supportsRef(i)})` };
  ws.columns.forEach((col, k) => (col.width = k === 4 ? 34 : 12));
}

/**
 * Build the schedule, compute it headless and write it.
 * @param output - destination path.
 */
export async function makeBeamSchedule(output: string): Promise<void> {
  const excel = new ExcelJS.Workbook();
  excel.creator = "Loadpath sample generator";
  excel.created = FIXED_DATE;
  excel.modified = FIXED_DATE;
  writeBeamsSheet(excel.addWorksheet("Beams"));
  writeLoadsSheet(excel.addWorksheet("Loads"));
  writeDiagramSheet(excel.addWorksheet("Diagram"));
  writeGravityLoadsSheet(excel.addWorksheet(GRAVITY_SHEET));
  const wb = fromExcelJs(excel);
  const summary = cacheResults(wb, await evaluateWorkbook(wb));
  if (summary.problems.length > 0) throw new Error(`the sample has formula errors: ${summary.problems.map((p) => `${p.sheet}!${p.address} ${p.message}`).join("; ")}`);
  writeFileSync(output, await deterministicPackage(await excel.xlsx.writeBuffer()));
}

/** The package with every part's zip timestamp set to {@link FIXED_DATE} (the zip writer stamps the current time). */
async function deterministicPackage(xlsx: ArrayBuffer | Buffer | ExcelJS.Buffer): Promise<Buffer> {
  const zip = await JSZip.loadAsync(xlsx as ArrayBuffer);
  zip.forEach((_path, entry) => {
    entry.date = FIXED_DATE;
  });
  return zip.generateAsync({ type: "nodebuffer", compression: "DEFLATE" });
}

if (require.main === module) {
  const output = join(__dirname, "beam-schedule.xlsx");
  makeBeamSchedule(output).then(
    () => console.log(`wrote ${output}`),
    (e: unknown) => {
      console.error(e);
      process.exit(1);
    },
  );
}
