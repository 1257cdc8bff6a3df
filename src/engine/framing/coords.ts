/**
 * Coordinate cells and polygon corners: a number, a grid name, or a grid name with an offset
 * (`B+2.5`, `3-1.25`), and polygons as `A/1; C/1; C/3; 12.5,40` (specs.ts COORDINATE_FORMS).
 * Everything returns a value or the reason it could not (errors are values).
 */
import { COORDINATE_FORMS } from "./specs";
import type { CellValue } from "../takedown/types";
import type { FramingProblemCode, Point } from "./types";

/** Grid lines by name: position of each X grid (constant x) and Y grid (constant y), ft or m. */
export interface GridLines {
  readonly x: ReadonlyMap<string, number>;
  readonly y: ReadonlyMap<string, number>;
}

/** A coordinate read, or why it could not be. */
export type Read<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly code: FramingProblemCode; readonly message: string };

function bad<T>(code: FramingProblemCode, message: string): Read<T> {
  return { ok: false, code, message };
}

/** Grid names are compared trimmed, case-insensitively. */
export function gridKey(name: string): string {
  return name.trim().toUpperCase();
}

/**
 * One coordinate (ft or m) from a cell.
 * @param cell - the cell value (number, text or blank)
 * @param axis - "x" for an X cell (names X grids), "y" for a Y cell
 * @param grids - the plan's grid lines
 * @param isDate - the cell holds a date (text like "3-1" the spreadsheet turned into a date)
 */
export function readCoordinate(cell: CellValue | undefined, axis: "x" | "y", grids: GridLines, isDate = false): Read<number> {
  if (isDate) return bad("badCoordinate", `holds a date (text like "3-1" turned into a date by the spreadsheet); type it as text ('3-1) or as a number`);
  if (typeof cell === "number") return Number.isFinite(cell) ? { ok: true, value: cell } : bad("badCoordinate", "is not a finite number");
  if (typeof cell !== "string" || cell.trim() === "") return bad("badCoordinate", "is blank or not a coordinate");
  return readCoordinateText(cell.trim(), axis, grids);
}

function readCoordinateText(text: string, axis: "x" | "y", grids: GridLines): Read<number> {
  const own = axis === "x" ? grids.x : grids.y;
  const other = axis === "x" ? grids.y : grids.x;
  const exact = own.get(gridKey(text));
  if (exact !== undefined) return { ok: true, value: exact };
  if (COORDINATE_FORMS.number.pattern.test(text)) return { ok: true, value: Number(text) };
  const m = COORDINATE_FORMS.offset.pattern.exec(text);
  if (m) {
    const base = own.get(gridKey(m[1]!));
    if (base !== undefined) return { ok: true, value: base + (m[2] === "-" ? -1 : 1) * Number(m[3]) };
  }
  const name = m && !other.has(gridKey(text)) ? m[1]! : text;
  if (other.has(gridKey(name))) return bad("unknownGrid", `names grid "${name}", which is a${axis === "x" ? " Y" : "n X"} grid (an ${axis.toUpperCase()} cell names ${axis.toUpperCase()} grids)`);
  if (m || /^[A-Za-z0-9.'"_ ]+$/.test(text)) return bad("unknownGrid", `names grid "${name}", which the Grids table does not have (forms: 12.5, ${COORDINATE_FORMS.offset.example}, a grid name)`);
  return bad("badCoordinate", `"${text}" is not a coordinate (forms: 12.5, a grid name, ${COORDINATE_FORMS.offset.example})`);
}

/**
 * A polygon from a Corners cell: corners separated by `;`, each `X/Y` (grid names, offsets or
 * numbers) or `x,y` (numbers). The repeated closing corner, if typed, is dropped.
 */
export function readCorners(cell: CellValue | undefined, grids: GridLines): Read<Point[]> {
  if (typeof cell !== "string" || cell.trim() === "") return bad("badCoordinate", `is not a list of corners (form: ${COORDINATE_FORMS.cornerSeparator.example})`);
  const out: Point[] = [];
  for (const raw of cell.split(COORDINATE_FORMS.cornerSeparator.separator)) {
    const text = raw.trim();
    if (text === "") continue;
    const sep = text.includes(COORDINATE_FORMS.gridCorner.separator) ? COORDINATE_FORMS.gridCorner.separator : COORDINATE_FORMS.xyCorner.separator;
    const parts = text.split(sep);
    if (parts.length !== 2) return bad("badCoordinate", `corner "${text}" is not X/Y or x,y (forms: ${COORDINATE_FORMS.gridCorner.example}, ${COORDINATE_FORMS.xyCorner.example})`);
    const x = readCoordinateText(parts[0]!.trim(), "x", grids);
    if (!x.ok) return bad(x.code, `corner "${text}": X ${x.message}`);
    const y = readCoordinateText(parts[1]!.trim(), "y", grids);
    if (!y.ok) return bad(y.code, `corner "${text}": Y ${y.message}`);
    out.push({ x: x.value, y: y.value });
  }
  return { ok: true, value: out };
}
