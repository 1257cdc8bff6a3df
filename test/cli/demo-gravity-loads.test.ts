/**
 * `loadpath demo`, Gravity loads part, end to end: the real command (node bin/loadpath.js, the
 * built dist/cli.js and dist/functions.js) recalculates sample-workbooks/beam-schedule.xlsx
 * headless; every value it prints for the Gravity loads sheet, and every row of the column's
 * combination records, is compared with a hand computation written out below. The recalculated
 * workbook it writes is checked at full precision, including the two beams of the schedule that
 * take their line loads from the sheet; then an input of the sheet is edited and `loadpath recalc`
 * must carry the change down the chain. Last, the sample's generator must write the same bytes on
 * every run, and the committed sample must be what it writes. Needs `npm run build`.
 *
 * Sources (all recalled from memory; verify against the standard):
 * - ASCE/SEI 7-22 Sec. 4.7.3, Eq. 4.7-1: L = Lo (0.25 + 15/sqrt(K_LL A_T)), no reduction while
 *   K_LL A_T < 400 ft^2, not below 0.50 Lo (one floor) or 0.40 Lo (two or more floors).
 * - ASCE/SEI 7-22 Table 4.7-2: K_LL = 4 for an interior column.
 * - ASCE/SEI 7-22 Sec. 4.7.4: live loads over 100 psf: a member supporting two or more floors may
 *   be reduced by at most 20 % (and not below Eq. 4.7-1).
 * - ASCE/SEI 7-22 Sec. 4.8.2, Eq. 4.8-1: Lr = Lo R1 R2, 12 <= Lr <= 20 psf; R1 = 1.2 - 0.001 A_T for
 *   200 < A_T < 600 ft^2, 0.6 from 600 ft^2; R2 = 1 for a rise F <= 4 in. per ft.
 * - ASCE/SEI 7-22 Sec. 2.3.1, 2.3.6 (LRFD) and 2.4.1, 2.4.5 (ASD) basic combinations. In 7-22 the
 *   snow load is at strength level, so its factors are 1.0S (principal), 0.3S (companion) and
 *   0.15S (with seismic) in LRFD, and 0.7S in ASD (0.75(0.7S) as a companion).
 * - Tributary width (half the spacing on each side, plus a slab overhang at an edge) and the
 *   conversion psf x ft = plf, / 1000 = kip/ft: common practice.
 * - Simple beam, uniform load w over span L: R = wL/2, Mmax = wL^2/8 (AISC Steel Construction
 *   Manual, Table 3-23, case 1; case number recalled from memory).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import ExcelJS from "exceljs";

const ROOT = resolve(__dirname, "../..");
const BIN = join(ROOT, "bin", "loadpath.js");
const SAMPLE = join(ROOT, "sample-workbooks", "beam-schedule.xlsx");
const dir = mkdtempSync(join(tmpdir(), "loadpath-demo-gravity-"));

function run(command: string, ...args: string[]): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(command, args, { cwd: ROOT, encoding: "utf8", maxBuffer: 32 * 1024 * 1024 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

// ---- The invented building's inputs, as entered on the sheet (psf, ft, kip/ft, kip) ----
const floorD = 80;
const officeLo = 50;
const storageLo = 125;
const roofD = 25;
const roofLo = 20;
const roofS = 30;

/** Hand computation of every item of the sheet for a beam spacing of `spacingFt` (8 ft in the sample). */
function handItems(spacingFt = 8): Record<string, number> {
  // Tributary widths (common practice): edge beam F-204 = half the spacing + the 1.25 ft overhang;
  // interior beam F-203 = half of each of its two spacings.
  const tribEdge = spacingFt / 2 + 1.25; // 8/2 + 1.25 = 5.25 ft
  const tribInt = spacingFt / 2 + 9 / 2; // 8/2 + 9/2 = 8.5 ft
  // Line loads: psf x ft = plf, / 1000 = kip/ft. Edge beam dead load adds 0.30 kip/ft of cladding.
  const wdEdge = (floorD * tribEdge) / 1000 + 0.3; // 420 plf + 300 plf = 0.72 kip/ft
  const wlEdge = (officeLo * tribEdge) / 1000; // 262.5 plf = 0.2625 kip/ft
  const wdInt = (floorD * tribInt) / 1000; // 680 plf = 0.68 kip/ft
  const wlInt = (officeLo * tribInt) / 1000; // 425 plf = 0.425 kip/ft

  // Roof girder RG-3: A_T = 32 x 15 = 480 ft^2, 200 < 480 < 600 so R1 = 1.2 - 0.001 x 480 = 0.72;
  // rise 1/4 in. per ft <= 4 so R2 = 1; Lr = 20 x 0.72 = 14.4 psf, inside 12..20 (Sec. 4.8.2).
  const rgArea = 32 * 15;
  const rgLr = roofLo * (1.2 - 0.001 * rgArea) * 1;
  const rgwLr = (rgLr * 15) / 1000; // 216 plf = 0.216 kip/ft

  // Interior column C-4: 750 ft^2 per level, three office floors: A_T = 2250 ft^2; K_LL = 4;
  // K_LL A_T = 9000 >= 400; factor 0.25 + 15/sqrt(9000) = 0.4081, above the 0.40 floor for a
  // member supporting two or more floors (Sec. 4.7.3); L = 50 x 0.4081 = 20.41 psf.
  const c4Area = 30 * 25;
  const c4FloorArea = c4Area * 3;
  const c4Factor = Math.max(0.25 + 15 / Math.sqrt(4 * c4FloorArea), 0.4);
  const c4L = officeLo * c4Factor;
  // Roof over C-4: A_T = 750 >= 600 so R1 = 0.6: 20 x 0.6 = 12 psf, the lower bound itself.
  const c4Lr = roofLo * 0.6;
  const D = (floorD * c4FloorArea + roofD * c4Area) / 1000; // (180,000 + 18,750) lb = 198.75 kip
  const L = (c4L * c4FloorArea) / 1000; // 45.91 kip
  const Lr = (c4Lr * c4Area) / 1000; // 9 kip
  const S = (roofS * c4Area) / 1000; // 22.5 kip
  const W = 8;
  const lrfd = lrfdRecord(D, L, Lr, S, W);
  const asd = asdRecord(D, L, Lr, S, W);

  // Archive column C-9: 125 psf > 100 psf, two floors, A_T = 2 x 600 = 1200 ft^2: Eq. 4.7-1 gives
  // 0.25 + 15/sqrt(4 x 1200) = 0.4665, but heavy live loads may be reduced by at most 20 %
  // (Sec. 4.7.4): factor max(0.80, 0.4665) = 0.80; L = 125 x 0.80 = 100 psf, x 1200 ft^2 = 120 kip.
  const c9L = storageLo * Math.max(0.8, 0.25 + 15 / Math.sqrt(4 * 1200));

  return {
    "Floor dead load: slab on deck, finishes, ceiling, services": floorD,
    "Office live load Lo": officeLo,
    "Archive (light storage) live load Lo": storageLo,
    "Roof dead load": roofD,
    "Roof live load Lo": roofLo,
    "Roof snow load (strength level)": roofS,
    "Beam spacing": spacingFt,
    "Spacing on the other side of F-203": 9,
    "Slab overhang past F-204": 1.25,
    "Cladding on F-204": 0.3,
    "F-204 tributary width (edge: blank spacing, overhang)": tribEdge,
    "F-204 dead line load, with cladding": wdEdge,
    "F-204 live line load (unreduced)": wlEdge,
    "F-203 tributary width (two spacings)": tribInt,
    "F-203 dead line load": wdInt,
    "F-203 live line load (unreduced)": wlInt,
    "RG-3 span": 32,
    "RG-3 tributary width": 15,
    "RG-3 tributary area A_T": rgArea,
    "Roof rise": 0.25,
    "RG-3 reduced roof live load Lr": rgLr,
    "RG-3 roof live line load": rgwLr,
    "C-4 tributary area per level (30 ft x 25 ft bay)": c4Area,
    "C-4 office floors supported": 3,
    "C-4 floor tributary area A_T": c4FloorArea,
    "C-4 reduced floor live load": c4L,
    "C-4 live load reduction factor L/Lo": c4Factor,
    "C-4 reduced roof live load": c4Lr,
    "C-4 dead load D": D,
    "C-4 floor live load L (reduced)": L,
    "C-4 roof live load Lr (reduced)": Lr,
    "C-4 snow load S": S,
    "C-4 wind axial load W (either sign)": W,
    "C-4 LRFD governing, max": Math.max(...Object.values(lrfd)),
    "C-4 LRFD governing, min (wind uplift)": Math.min(...Object.values(lrfd)),
    "C-4 ASD governing, max": Math.max(...Object.values(asd)),
    "C-4 ASD governing, min (wind uplift)": Math.min(...Object.values(asd)),
    "C-9 tributary area per level (24 ft x 25 ft bay)": 600,
    "C-9 storage floors supported": 2,
    "C-9 storage live load (heavy: at most 20 % off)": c9L,
    "C-9 storage live load L": (c9L * 1200) / 1000,
  };
}

/**
 * ASCE/SEI 7-22 strength design combinations written out (Sec. 2.3.1 and 2.3.6), R = 0 and E = 0
 * on this column; W taken with both signs. Snow factors 0.3S / 1.0S / 0.15S (strength-level snow).
 */
function lrfdRecord(D: number, L: number, Lr: number, S: number, W: number): Record<string, number> {
  return {
    "2.3.1 (1) 1.4D": 1.4 * D,
    "2.3.1 (2) 1.2D + 1.6L + 0.5Lr": 1.2 * D + 1.6 * L + 0.5 * Lr,
    "2.3.1 (2) 1.2D + 1.6L + 0.3S": 1.2 * D + 1.6 * L + 0.3 * S,
    "2.3.1 (2) 1.2D + 1.6L + 0.5R": 1.2 * D + 1.6 * L,
    "2.3.1 (3) 1.2D + 1.6Lr + L": 1.2 * D + 1.6 * Lr + L,
    "2.3.1 (3) 1.2D + 1.6Lr + 0.5W": 1.2 * D + 1.6 * Lr + 0.5 * W,
    "2.3.1 (3) 1.2D + 1.6Lr - 0.5W": 1.2 * D + 1.6 * Lr - 0.5 * W,
    "2.3.1 (3) 1.2D + 1.0S + L": 1.2 * D + S + L,
    "2.3.1 (3) 1.2D + 1.0S + 0.5W": 1.2 * D + S + 0.5 * W,
    "2.3.1 (3) 1.2D + 1.0S - 0.5W": 1.2 * D + S - 0.5 * W,
    "2.3.1 (3) 1.2D + 1.6R + L": 1.2 * D + L,
    "2.3.1 (3) 1.2D + 1.6R + 0.5W": 1.2 * D + 0.5 * W,
    "2.3.1 (3) 1.2D + 1.6R - 0.5W": 1.2 * D - 0.5 * W,
    "2.3.1 (4) 1.2D + 1.0W + L + 0.5Lr": 1.2 * D + W + L + 0.5 * Lr,
    "2.3.1 (4) 1.2D + 1.0W + L + 0.3S": 1.2 * D + W + L + 0.3 * S,
    "2.3.1 (4) 1.2D + 1.0W + L + 0.5R": 1.2 * D + W + L,
    "2.3.1 (4) 1.2D - 1.0W + L + 0.5Lr": 1.2 * D - W + L + 0.5 * Lr,
    "2.3.1 (4) 1.2D - 1.0W + L + 0.3S": 1.2 * D - W + L + 0.3 * S,
    "2.3.1 (4) 1.2D - 1.0W + L + 0.5R": 1.2 * D - W + L,
    "2.3.1 (5) 0.9D + 1.0W": 0.9 * D + W,
    "2.3.1 (5) 0.9D - 1.0W": 0.9 * D - W,
    "2.3.6 (6) 1.2D + E + L + 0.15S": 1.2 * D + L + 0.15 * S,
    "2.3.6 (6) 1.2D - E + L + 0.15S": 1.2 * D + L + 0.15 * S,
    "2.3.6 (7) 0.9D + E": 0.9 * D,
    "2.3.6 (7) 0.9D - E": 0.9 * D,
  };
}

/**
 * ASCE/SEI 7-22 allowable stress design combinations written out (Sec. 2.4.1 and 2.4.5), R = 0 and
 * E = 0 on this column; W with both signs. Snow 0.7S, and 0.75(0.7S) = 0.525S as a companion.
 */
function asdRecord(D: number, L: number, Lr: number, S: number, W: number): Record<string, number> {
  return {
    "2.4.1 (1) D": D,
    "2.4.1 (2) D + L": D + L,
    "2.4.1 (3) D + Lr": D + Lr,
    "2.4.1 (3) D + 0.7S": D + 0.7 * S,
    "2.4.1 (3) D + R": D,
    "2.4.1 (4) D + 0.75L + 0.75Lr": D + 0.75 * L + 0.75 * Lr,
    "2.4.1 (4) D + 0.75L + 0.75(0.7S)": D + 0.75 * L + 0.525 * S,
    "2.4.1 (4) D + 0.75L + 0.75R": D + 0.75 * L,
    "2.4.1 (5) D + 0.6W": D + 0.6 * W,
    "2.4.1 (5) D - 0.6W": D - 0.6 * W,
    "2.4.1 (6) D + 0.75L + 0.75(0.6W) + 0.75Lr": D + 0.75 * L + 0.45 * W + 0.75 * Lr,
    "2.4.1 (6) D + 0.75L + 0.75(0.6W) + 0.75(0.7S)": D + 0.75 * L + 0.45 * W + 0.525 * S,
    "2.4.1 (6) D + 0.75L + 0.75(0.6W) + 0.75R": D + 0.75 * L + 0.45 * W,
    "2.4.1 (6) D + 0.75L - 0.75(0.6W) + 0.75Lr": D + 0.75 * L - 0.45 * W + 0.75 * Lr,
    "2.4.1 (6) D + 0.75L - 0.75(0.6W) + 0.75(0.7S)": D + 0.75 * L - 0.45 * W + 0.525 * S,
    "2.4.1 (6) D + 0.75L - 0.75(0.6W) + 0.75R": D + 0.75 * L - 0.45 * W,
    "2.4.1 (7) 0.6D + 0.6W": 0.6 * D + 0.6 * W,
    "2.4.1 (7) 0.6D - 0.6W": 0.6 * D - 0.6 * W,
    "2.4.5 (8) 1.0D + 0.7E": D,
    "2.4.5 (8) 1.0D - 0.7E": D,
    "2.4.5 (9) 1.0D + 0.525E + 0.75L + 0.75(0.7S)": D + 0.75 * L + 0.525 * S,
    "2.4.5 (9) 1.0D - 0.525E + 0.75L + 0.75(0.7S)": D + 0.75 * L + 0.525 * S,
    "2.4.5 (10) 0.6D + 0.7E": 0.6 * D,
    "2.4.5 (10) 0.6D - 0.7E": 0.6 * D,
  };
}

/** The hand column loads of the sample (for the records). */
function handColumn(): { D: number; L: number; Lr: number; S: number; W: number } {
  const h = handItems();
  return { D: h["C-4 dead load D"]!, L: h["C-4 floor live load L (reduced)"]!, Lr: h["C-4 roof live load Lr (reduced)"]!, S: h["C-4 snow load S"]!, W: 8 };
}

/** A printed value (6 significant digits) agrees with the hand value to its printed precision. */
function expectPrinted(printed: number, hand: number, what: string): void {
  expect(Math.abs(printed - hand), `${what}: printed ${printed}, by hand ${hand}`).toBeLessThanOrEqual(5.0001e-6 * Math.max(Math.abs(hand), 1e-12) + 1e-12);
}

/** The lines of one demo section, from its "== title" line to the next section or the caution. */
function section(stdout: string, titleStart: string): string[] {
  const lines = stdout.split("\n");
  const start = lines.findIndex((l) => l.startsWith(`== ${titleStart}`));
  expect(start, `section "${titleStart}" in the demo output`).toBeGreaterThanOrEqual(0);
  const rest = lines.slice(start + 1);
  const end = rest.findIndex((l) => l.startsWith("== ") || l.startsWith("Caution:"));
  return end < 0 ? rest : rest.slice(0, end);
}

interface PrintedItem {
  readonly cell: string;
  readonly formula: string;
  readonly value: number;
  readonly unit: string;
}

/** Item rows of the printed table: "B15  label  =FORMULA  5.25  ft" (columns at least 2 spaces apart). */
function printedItems(lines: readonly string[]): Map<string, PrintedItem> {
  const items = new Map<string, PrintedItem>();
  for (const line of lines) {
    if (!/^B\d+ /.test(line)) continue;
    const [cell, label, formula, value, unit = ""] = line.split(/ {2,}/);
    items.set(label!, { cell: cell!, formula: formula!, value: Number(value), unit });
  }
  return items;
}

/** Combination record rows printed as "2.3.1 (2) 1.2D + 1.6L + 0.3S   318.71" (two records side by side). */
function printedRecords(lines: readonly string[]): Map<string, number> {
  const rows = new Map<string, number>();
  for (const line of lines) for (const m of line.matchAll(/(\d\.\d\.\d \(\d+\) .+?) {2,}(-?\d+(?:\.\d+)?)(?= |$)/g)) rows.set(m[1]!, Number(m[2]));
  return rows;
}

async function sheetOf(path: string, name: string): Promise<ExcelJS.Worksheet> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.readFile(path);
  return wb.getWorksheet(name)!;
}

/** Column B value of the row whose label (column A) is `label`. */
function valueByLabel(ws: ExcelJS.Worksheet, label: string): unknown {
  for (let r = 1; r <= ws.rowCount; r++) if (ws.getCell(r, 1).value === label) return ws.getCell(r, 2).result ?? ws.getCell(r, 2).value;
  throw new Error(`no row "${label}"`);
}

/** Beams sheet row of a mark: reactions (F, G) and Mmax (I). */
function beamRow(ws: ExcelJS.Worksheet, mark: string): { r1: number; r2: number; mMax: number } {
  for (let r = 2; r <= ws.rowCount; r++) {
    if (ws.getCell(r, 1).value !== mark) continue;
    const num = (c: string): number => Number(ws.getCell(`${c}${r}`).result ?? ws.getCell(`${c}${r}`).value);
    return { r1: num("F"), r2: num("G"), mMax: num("I") };
  }
  throw new Error(`no member ${mark}`);
}

/** Simple beam, full-length uniform load (AISC Table 3-23, case 1, recalled): R = wL/2, M = wL^2/8. */
function simpleBeam(wKipPerFt: number, spanFt: number): { reaction: number; moment: number } {
  return { reaction: (wKipPerFt * spanFt) / 2, moment: (wKipPerFt * spanFt ** 2) / 8 };
}

describe("loadpath demo: Gravity loads part", () => {
  let demo: ReturnType<typeof run>;
  let lines: string[];
  beforeAll(() => {
    demo = run(process.execPath, BIN, "demo");
    lines = section(demo.stdout, "Gravity loads");
  });

  it("runs cleanly and prints the part after the beam schedule", () => {
    expect(demo.stderr).toBe("");
    expect(demo.status).toBe(0);
    expect(demo.stdout.indexOf("== Gravity loads")).toBeGreaterThan(demo.stdout.indexOf("== Beam schedule"));
    expect(lines.some((l) => /^Cell +Item +Formula +Value +Unit$/.test(l))).toBe(true);
    expect(lines.join("\n")).toMatch(/0 errors\. Members of the schedule above with loads linked to it: F-203, F-204\./);
  });

  it("prints every item with the value worked by hand", () => {
    const printed = printedItems(lines);
    const hand = handItems();
    expect([...printed.keys()].sort()).toEqual(Object.keys(hand).sort());
    for (const [label, value] of Object.entries(hand)) expectPrinted(printed.get(label)!.value, value, label);
    // Spot values worked on paper: 8/2 + 1.25 = 5.25 ft; 80 x 5.25 / 1000 + 0.30 = 0.72 kip/ft;
    // 50 x (0.25 + 15/sqrt(4 x 2250)) = 20.4057 psf; 125 x 0.8 = 100 psf; 1.2 x 198.75 + 1.6 x 45.9128 + 0.3 x 22.5 = 318.710 kip.
    expect(printed.get("F-204 tributary width (edge: blank spacing, overhang)")!.value).toBe(5.25);
    expect(printed.get("F-204 dead line load, with cladding")!.value).toBe(0.72);
    expect(printed.get("C-4 reduced floor live load")!.value).toBe(20.4057);
    expect(printed.get("C-9 storage live load (heavy: at most 20 % off)")!.value).toBe(100);
    expect(printed.get("C-4 LRFD governing, max")!.value).toBe(318.71);
    expect(printed.get("C-4 LRFD governing, min (wind uplift)")!.value).toBe(170.875); // 0.9 x 198.75 - 8
    expect(printed.get("C-4 ASD governing, max")!.value).toBe(248.597); // 198.75 + 0.75 x 45.9128 + 0.45 x 8 + 0.525 x 22.5
    expect(printed.get("C-4 ASD governing, min (wind uplift)")!.value).toBe(114.45); // 0.6 x 198.75 - 0.6 x 8
  });

  it("prints the formulas as typed, with the unit conversion visible", () => {
    const printed = printedItems(lines);
    const formula = (label: string): string => printed.get(label)!.formula;
    expect(formula("Beam spacing")).toBe("(input)");
    expect(formula("F-204 tributary width (edge: blank spacing, overhang)")).toMatch(/^=LOADPATH\.TRIB_WIDTH\(B\d+,"",,B\d+\)$/);
    expect(formula("F-203 tributary width (two spacings)")).toMatch(/^=LOADPATH\.TRIB_WIDTH\(B\d+,B\d+\)$/);
    for (const label of ["F-204 dead line load, with cladding", "F-204 live line load (unreduced)", "F-203 dead line load", "F-203 live line load (unreduced)", "RG-3 roof live line load"]) {
      expect(formula(label)).toMatch(/^=LOADPATH\.LINE_LOAD\(B\d+\/1000,B\d+(,B\d+)?\)$/);
    }
    expect(formula("C-4 reduced floor live load")).toMatch(/^=LOADPATH\.LL_REDUCE\(B\d+,LOADPATH\.KLL\("interior column"\),B\d+,B\d+\)$/);
    expect(formula("C-9 storage live load (heavy: at most 20 % off)")).toMatch(/^=LOADPATH\.LL_HEAVY\(/);
    expect(formula("RG-3 reduced roof live load Lr")).toMatch(/^=LOADPATH\.ROOF_LL_REDUCE\(/);
    expect(formula("C-4 LRFD governing, min (wind uplift)")).toMatch(/^=LOADPATH\.COMBINE\(.*,"LRFD","min"\)$/);
    expect(printed.get("F-203 dead line load")!.unit).toBe("kip/ft");
    expect(printed.get("C-4 reduced floor live load")!.unit).toBe("psf");
    expect(printed.get("C-4 dead load D")!.unit).toBe("kip");
  });

  it("prints both combination records, every row equal to the combination written out by hand", () => {
    const printed = printedRecords(lines);
    const { D, L, Lr, S, W } = handColumn();
    const hand = { ...lrfdRecord(D, L, Lr, S, W), ...asdRecord(D, L, Lr, S, W) };
    expect(Object.keys(hand)).toHaveLength(25 + 24);
    expect([...printed.keys()].sort()).toEqual(Object.keys(hand).sort());
    for (const [label, value] of Object.entries(hand)) expectPrinted(printed.get(label)!, value, label);
  });

  it("writes the recalculated workbook: the sheet at full precision, F-203 and F-204 loaded from it", async () => {
    const output = /recalculated workbook: (.+\.xlsx)$/m.exec(demo.stdout)?.[1];
    expect(output).toBeDefined();
    const gravity = await sheetOf(output!, "Gravity loads");
    for (const [label, value] of Object.entries(handItems())) expect(Number(valueByLabel(gravity, label)), label).toBeCloseTo(value, 9);
    const beams = await sheetOf(output!, "Beams");
    const h = handItems();
    const cases: [string, number][] = [
      ["F-203", h["F-203 dead line load"]! + h["F-203 live line load (unreduced)"]!], // 0.68 + 0.425 = 1.105 kip/ft
      ["F-204", h["F-204 dead line load, with cladding"]! + h["F-204 live line load (unreduced)"]!], // 0.72 + 0.2625 = 0.9825 kip/ft
    ];
    for (const [mark, w] of cases) {
      const row = beamRow(beams, mark);
      const e = simpleBeam(w, 28);
      expect(row.r1, `${mark} R1`).toBeCloseTo(e.reaction, 9);
      expect(row.r2, `${mark} R2`).toBeCloseTo(e.reaction, 9);
      expect(row.mMax, `${mark} Mmax`).toBeCloseTo(e.moment, 9);
    }
  });

  it("the chain is live: a wider beam spacing on the sheet reaches the schedule's beams", async () => {
    const input = join(dir, "edited.xlsx");
    const output = join(dir, "edited-out.xlsx");
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.readFile(SAMPLE);
    const ws = wb.getWorksheet("Gravity loads")!;
    let edited = false;
    ws.eachRow((row) => {
      if (row.getCell(1).value === "Beam spacing") {
        row.getCell(2).value = 10;
        edited = true;
      }
    });
    expect(edited).toBe(true);
    await wb.xlsx.writeFile(input);
    const r = run(process.execPath, BIN, "recalc", input, "-o", output);
    expect(r.stderr).toBe("");
    expect(r.status).toBe(0);
    const gravity = await sheetOf(output, "Gravity loads");
    const h = handItems(10);
    expect(h["F-204 tributary width (edge: blank spacing, overhang)"]).toBe(6.25); // 10/2 + 1.25
    expect(h["F-203 tributary width (two spacings)"]).toBe(9.5); // 10/2 + 9/2
    for (const [label, value] of Object.entries(h)) expect(Number(valueByLabel(gravity, label)), label).toBeCloseTo(value, 9);
    const beams = await sheetOf(output, "Beams");
    const w203 = (80 * 9.5 + 50 * 9.5) / 1000; // 1.235 kip/ft
    const w204 = (80 * 6.25) / 1000 + 0.3 + (50 * 6.25) / 1000; // 1.1125 kip/ft
    expect(beamRow(beams, "F-203").mMax).toBeCloseTo(simpleBeam(w203, 28).moment, 9);
    expect(beamRow(beams, "F-204").r1).toBeCloseTo(simpleBeam(w204, 28).reaction, 9);
  });
});

describe("sample workbook generator", () => {
  const tsx = join(ROOT, "node_modules", ".bin", "tsx");
  const generate = (out: string) =>
    run(tsx, "-e", `require(${JSON.stringify(join(ROOT, "sample-workbooks", "make-beam-schedule.ts"))}).makeBeamSchedule(${JSON.stringify(out)}).catch((e) => { console.error(e); process.exit(1); })`);

  it("writes the same bytes on every run, and the committed sample is what it writes", () => {
    const a = join(dir, "a.xlsx");
    const b = join(dir, "b.xlsx");
    const first = generate(a);
    expect(first.stderr).toBe("");
    expect(first.status).toBe(0);
    expect(generate(b).status).toBe(0);
    expect(readFileSync(a).equals(readFileSync(b))).toBe(true);
    expect(readFileSync(a).equals(readFileSync(SAMPLE)), "sample-workbooks/beam-schedule.xlsx is stale: run npx tsx sample-workbooks/make-beam-schedule.ts after npm run build").toBe(true);
  });
});
