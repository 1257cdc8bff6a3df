/**
 * Types shared by the takedown engine: the input tables as read, the problems found in them and
 * the load cases carried. The takedown contract (src/workbook/takedown-api.ts) re-exports these
 * declarations; the table shapes match the workbook port (src/workbook/port.ts) structurally, so
 * the engine needs no import from the layers above it.
 */

/** A cell's content as read: number, text, boolean, blank (null) or an error text like "#DIV/0!". */
export type CellValue = number | string | boolean | null;

/** A rectangular block read from a sheet: the header row first, 0-based position of its top-left cell. */
export interface TableData {
  readonly sheet: string;
  readonly top: number;
  readonly left: number;
  readonly values: readonly (readonly CellValue[])[];
  /**
   * Where known, true for each cell that holds a date (a number the sheet shows as a date), row by
   * row like `values`: a mark or level typed as "3-1" that the spreadsheet turned into a date.
   */
  readonly dates?: readonly (readonly boolean[])[];
}

/** Unit system of a takedown: US (ft, psf, plf, lb in; kip, kip-ft out) or SI (m, kPa, kN/m, kN, kN·m). */
export type UnitSystem = "US" | "SI";

/** The gravity load cases a takedown carries, in the order they appear everywhere. */
export type LoadCase = "D" | "L" | "Lr" | "S" | "R";

/** Every load case, in order. */
export const LOAD_CASES: readonly LoadCase[] = ["D", "L", "Lr", "S", "R"];

/** The closed set of things a takedown input can get wrong (same codes as the takedown contract). */
export type ProblemCode =
  | "duplicateMark"
  | "unknownSupport"
  | "cycle"
  | "badSpan"
  | "supportOutside"
  | "selfSupport"
  | "columnWithoutBase"
  | "unitMismatch"
  | "missingColumn"
  /** Two columns fit one needed column (or one column was given for two): none is taken. */
  | "ambiguousColumn"
  | "missingTable"
  | "badValue"
  | "unknownZone"
  | "unknownType"
  | "missingPosition"
  | "foreignSheet"
  /** The Members table has no member rows. */
  | "emptyTable"
  /** A member carries more load rows than the worksheet functions accept. */
  | "tooManyLoads"
  /** A continuous member whose supports cannot hold it (two supports at one point). */
  | "unstable"
  /** A computed result on the generated sheet is an error value, or a number that is not finite. */
  | "errorResult"
  /** Framing plan problems (docs/interface.md, framing plan): see src/engine/framing/types.ts. */
  | "endOnNothing"
  | "equalRankCrossing"
  | "overlappingDecks"
  | "unsupportedDeck"
  | "collinearOverlap"
  | "duplicateColumn"
  | "unknownGrid"
  | "badCoordinate"
  | "zeroLength"
  | "selfIntersecting"
  | "badTwoWay"
  | "unknownLevel";

/** One thing wrong with the input, with the sheet and A1 cell to select. */
export interface Problem {
  readonly code: ProblemCode;
  readonly message: string;
  readonly sheet: string;
  /** A1 address on that sheet. */
  readonly cell: string;
  readonly mark?: string;
}

/** A cell of a sheet, 0-based row and column. */
export interface CellRef {
  readonly sheet: string;
  readonly row: number;
  readonly col: number;
}
