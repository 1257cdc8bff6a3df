/**
 * The "Gravity loads" sheet of the sample workbook: the load derivation of an invented building
 * (three office floors and a flat roof, with an archive bay of two storage floors; every mark and
 * number is made up for the demo) written with the LOADPATH load functions. Two of its beams, F-203
 * and F-204, are members of the Beams sheet, whose loads link to this sheet's line loads.
 *
 * Units: psf, ft, ft², kip/ft, kip. The psf x ft = plf, / 1000 = kip/ft conversion is written in
 * each LINE_LOAD formula.
 */
import type ExcelJS from "exceljs";

/** Name of the sheet. */
export const GRAVITY_SHEET = "Gravity loads";

/** A row of the sheet: a section heading, or an item with a value (number, or formula text). */
export type GravityRow =
  | { readonly section: string }
  | {
      /** Key other rows use as `{key}` in their formulas (it becomes this row's B cell). */
      readonly key: string;
      readonly label: string;
      /** A number (an input) or a formula without "=", with `{key}` placeholders. */
      readonly value: number | string;
      readonly unit: string;
      readonly basis: string;
    };

/** Row (1-based) of the first entry of {@link GRAVITY_ROWS}; rows 1-2 hold the title and headers. */
const FIRST_ROW = 3;

/** Arguments shared by the column's COMBINE and COMBOS calls: D, L, Lr, S, R (none), W. */
const COLUMN_EFFECTS = "{cD},{cL},{cLr},{cS},,{cW}";

/** The derivation, top to bottom. */
export const GRAVITY_ROWS: readonly GravityRow[] = [
  { section: "Area loads" },
  { key: "floorD", label: "Floor dead load: slab on deck, finishes, ceiling, services", value: 80, unit: "psf", basis: "invented" },
  { key: "officeL", label: "Office live load Lo", value: 50, unit: "psf", basis: "office floors, ASCE/SEI 7-22 Table 4.3-1 (recalled)" },
  { key: "storageL", label: "Archive (light storage) live load Lo", value: 125, unit: "psf", basis: "ASCE/SEI 7-22 Table 4.3-1 (recalled)" },
  { key: "roofD", label: "Roof dead load", value: 25, unit: "psf", basis: "invented" },
  { key: "roofLr", label: "Roof live load Lo", value: 20, unit: "psf", basis: "ordinary flat roof" },
  { key: "roofS", label: "Roof snow load (strength level)", value: 30, unit: "psf", basis: "invented; ASCE/SEI 7-22 Ch. 7 level" },
  { section: "Floor beams F-203 (interior) and F-204 (edge, slab overhang), level 2" },
  { key: "spacing", label: "Beam spacing", value: 8, unit: "ft", basis: "framing plan" },
  { key: "spacing2", label: "Spacing on the other side of F-203", value: 9, unit: "ft", basis: "framing plan" },
  { key: "overhang", label: "Slab overhang past F-204", value: 1.25, unit: "ft", basis: "framing plan" },
  { key: "cladding", label: "Cladding on F-204", value: 0.3, unit: "kip/ft", basis: "invented" },
  { key: "tribEdge", label: "F-204 tributary width (edge: blank spacing, overhang)", value: 'LOADPATH.TRIB_WIDTH({spacing},"",,{overhang})', unit: "ft", basis: "half spacing + overhang" },
  { key: "wdEdge", label: "F-204 dead line load, with cladding", value: "LOADPATH.LINE_LOAD({floorD}/1000,{tribEdge},{cladding})", unit: "kip/ft", basis: "psf x ft / 1000" },
  { key: "wlEdge", label: "F-204 live line load (unreduced)", value: "LOADPATH.LINE_LOAD({officeL}/1000,{tribEdge})", unit: "kip/ft", basis: "psf x ft / 1000" },
  { key: "tribInt", label: "F-203 tributary width (two spacings)", value: "LOADPATH.TRIB_WIDTH({spacing},{spacing2})", unit: "ft", basis: "half of each spacing" },
  { key: "wdInt", label: "F-203 dead line load", value: "LOADPATH.LINE_LOAD({floorD}/1000,{tribInt})", unit: "kip/ft", basis: "psf x ft / 1000" },
  { key: "wlInt", label: "F-203 live line load (unreduced)", value: "LOADPATH.LINE_LOAD({officeL}/1000,{tribInt})", unit: "kip/ft", basis: "psf x ft / 1000" },
  { section: "Roof girder RG-3 (flat roof, 1/4 in. per ft)" },
  { key: "rgSpan", label: "RG-3 span", value: 32, unit: "ft", basis: "framing plan" },
  { key: "rgTrib", label: "RG-3 tributary width", value: 15, unit: "ft", basis: "framing plan" },
  { key: "rgArea", label: "RG-3 tributary area A_T", value: "{rgSpan}*{rgTrib}", unit: "ft²", basis: "span x width" },
  { key: "rgRise", label: "Roof rise", value: 0.25, unit: "in/ft", basis: "roof plan" },
  { key: "rgLr", label: "RG-3 reduced roof live load Lr", value: "LOADPATH.ROOF_LL_REDUCE({roofLr},{rgArea},{rgRise})", unit: "psf", basis: "ASCE/SEI 7-22 Sec. 4.8.2" },
  { key: "rgwLr", label: "RG-3 roof live line load", value: "LOADPATH.LINE_LOAD({rgLr}/1000,{rgTrib})", unit: "kip/ft", basis: "psf x ft / 1000" },
  { section: "Interior column C-4 (three office floors and the roof)" },
  { key: "c4Area", label: "C-4 tributary area per level (30 ft x 25 ft bay)", value: "30*25", unit: "ft²", basis: "framing plan" },
  { key: "c4Floors", label: "C-4 office floors supported", value: 3, unit: "", basis: "levels 2 to 4" },
  { key: "c4FloorArea", label: "C-4 floor tributary area A_T", value: "{c4Area}*{c4Floors}", unit: "ft²", basis: "sum over the floors" },
  { key: "c4L", label: "C-4 reduced floor live load", value: 'LOADPATH.LL_REDUCE({officeL},LOADPATH.KLL("interior column"),{c4FloorArea},{c4Floors})', unit: "psf", basis: "ASCE/SEI 7-22 Sec. 4.7.3" },
  { key: "c4Factor", label: "C-4 live load reduction factor L/Lo", value: "{c4L}/{officeL}", unit: "", basis: "" },
  { key: "c4Lr", label: "C-4 reduced roof live load", value: "LOADPATH.ROOF_LL_REDUCE({roofLr},{c4Area})", unit: "psf", basis: "ASCE/SEI 7-22 Sec. 4.8.2" },
  { key: "cD", label: "C-4 dead load D", value: "({floorD}*{c4FloorArea}+{roofD}*{c4Area})/1000", unit: "kip", basis: "psf x ft² / 1000" },
  { key: "cL", label: "C-4 floor live load L (reduced)", value: "{c4L}*{c4FloorArea}/1000", unit: "kip", basis: "psf x ft² / 1000" },
  { key: "cLr", label: "C-4 roof live load Lr (reduced)", value: "{c4Lr}*{c4Area}/1000", unit: "kip", basis: "psf x ft² / 1000" },
  { key: "cS", label: "C-4 snow load S", value: "{roofS}*{c4Area}/1000", unit: "kip", basis: "psf x ft² / 1000" },
  { key: "cW", label: "C-4 wind axial load W (either sign)", value: 8, unit: "kip", basis: "invented, lateral frame" },
  { key: "cLrfdMax", label: "C-4 LRFD governing, max", value: `LOADPATH.COMBINE(${COLUMN_EFFECTS})`, unit: "kip", basis: "ASCE/SEI 7-22 Sec. 2.3" },
  { key: "cLrfdMin", label: "C-4 LRFD governing, min (wind uplift)", value: `LOADPATH.COMBINE(${COLUMN_EFFECTS},,"LRFD","min")`, unit: "kip", basis: "ASCE/SEI 7-22 Sec. 2.3" },
  { key: "cAsdMax", label: "C-4 ASD governing, max", value: `LOADPATH.COMBINE(${COLUMN_EFFECTS},,"ASD")`, unit: "kip", basis: "ASCE/SEI 7-22 Sec. 2.4" },
  { key: "cAsdMin", label: "C-4 ASD governing, min (wind uplift)", value: `LOADPATH.COMBINE(${COLUMN_EFFECTS},,"ASD","min")`, unit: "kip", basis: "ASCE/SEI 7-22 Sec. 2.4" },
  { section: "Archive column C-9 (two storage floors)" },
  { key: "c9Area", label: "C-9 tributary area per level (24 ft x 25 ft bay)", value: "24*25", unit: "ft²", basis: "framing plan" },
  { key: "c9Floors", label: "C-9 storage floors supported", value: 2, unit: "", basis: "levels 2 and 3" },
  { key: "c9L", label: "C-9 storage live load (heavy: at most 20 % off)", value: 'LOADPATH.LL_HEAVY({storageL},LOADPATH.KLL("interior column"),{c9Area}*{c9Floors},{c9Floors})', unit: "psf", basis: "ASCE/SEI 7-22 Sec. 4.7.4" },
  { key: "c9LKip", label: "C-9 storage live load L", value: "{c9L}*{c9Area}*{c9Floors}/1000", unit: "kip", basis: "psf x ft² / 1000" },
];

/** Row (1-based) of each keyed entry. */
const ROW_OF: ReadonlyMap<string, number> = new Map(GRAVITY_ROWS.flatMap((r, i) => ("key" in r ? [[r.key, FIRST_ROW + i] as const] : [])));

/** Top-left cell of each COMBOS record (label | value, 25 rows). */
export const RECORD_CELLS = { LRFD: "F3", ASD: "I3" } as const;

/**
 * The B cell of a keyed row, e.g. "B16".
 * @param key - a key of {@link GRAVITY_ROWS}.
 * @throws Error for an unknown key (a mistake in this generator, not in user input).
 */
export function gravityCell(key: string): string {
  const row = ROW_OF.get(key);
  if (row === undefined) throw new Error(`no row "${key}" on the ${GRAVITY_SHEET} sheet`);
  return `B${row}`;
}

/**
 * A keyed row's value as a reference from another sheet, e.g. "'Gravity loads'!$B$16".
 * @param key - a key of {@link GRAVITY_ROWS}.
 */
export function gravityRef(key: string): string {
  return `'${GRAVITY_SHEET}'!${gravityCell(key).replace(/^B/, "$B$")}`;
}

/** Formula text with its `{key}` placeholders replaced by cells. */
function resolve(template: string): string {
  return template.replace(/\{(\w+)\}/g, (_m, key: string) => gravityCell(key));
}

/**
 * Fill the sheet: title, headers, the derivation in columns A-D, and the COMBOS records of
 * column C-4 (LRFD in F:G, ASD in I:J).
 * @param ws - an empty worksheet named {@link GRAVITY_SHEET}.
 */
export function writeGravityLoadsSheet(ws: ExcelJS.Worksheet): void {
  ws.getCell("A1").value =
    "Gravity loads of an invented building (three office floors, flat roof, archive bay). Units: psf, ft, ft², kip/ft, kip. For review by a qualified engineer; local codes govern.";
  ws.getRow(2).values = ["Item", "Value", "Unit", "Basis", "", "LRFD combinations of C-4 (COMBOS)", "kip", "", "ASD combinations of C-4 (COMBOS)", "kip"];
  ws.getRow(2).font = { bold: true };
  GRAVITY_ROWS.forEach((r, i) => {
    const row = ws.getRow(FIRST_ROW + i);
    if ("section" in r) {
      row.getCell(1).value = r.section;
      row.getCell(1).font = { bold: true };
      return;
    }
    row.getCell(1).value = r.label;
    row.getCell(2).value = typeof r.value === "number" ? r.value : { formula: resolve(r.value) };
    row.getCell(3).value = r.unit;
    row.getCell(4).value = r.basis;
  });
  ws.getCell(RECORD_CELLS.LRFD).value = { formula: resolve(`LOADPATH.COMBOS(${COLUMN_EFFECTS})`) };
  ws.getCell(RECORD_CELLS.ASD).value = { formula: resolve(`LOADPATH.COMBOS(${COLUMN_EFFECTS},,"ASD")`) };
  ws.columns.forEach((col, k) => (col.width = [52, 12, 8, 36, 3, 44, 10, 3, 44, 10][k] ?? 10));
  ws.getColumn(2).numFmt = "0.0###";
  ws.getColumn(7).numFmt = "0.00";
  ws.getColumn(10).numFmt = "0.00";
}
