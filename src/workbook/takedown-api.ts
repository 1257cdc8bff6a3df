/**
 * The contract between the takedown builder (src/engine/takedown + the orchestrator that runs it
 * over a WorkbookPort) and its callers: the task pane and the `loadpath takedown` command.
 * Shapes of the JSON follow design.md section 5 exactly.
 */
import type { SheetPlan, TakedownModel } from "../engine/takedown";
import type { WorkbookPort } from "./port";

export type UnitSystem = "US" | "SI";

/** Load cases carried through a takedown. */
export type LoadCase = "D" | "L" | "Lr" | "S" | "R";

/**
 * Column mapping for tables whose headers differ from the defaults of design.md section 4:
 * canonical header (e.g. "Trib") -> the header the user's table has (e.g. "Trib width").
 */
export interface ColumnMapping {
  readonly zones?: Readonly<Record<string, string>>;
  readonly members?: Readonly<Record<string, string>>;
  readonly loads?: Readonly<Record<string, string>>;
}

export interface TakedownOptions {
  /** Table name, sheet name (used range) or "Sheet!A1:G20" of each input table. */
  readonly zones: string;
  readonly members: string;
  readonly loads?: string;
  readonly units: UnitSystem;
  readonly mapping?: ColumnMapping;
  /** Name of the generated sheet (default "Takedown"). */
  readonly sheetName?: string;
  /** Replace a same-named sheet the add-in did not create (only after asking the user). */
  readonly replaceForeign?: boolean;
  /** Hand-off mode: classic spreadsheet functions only, no add-in functions. */
  readonly native?: boolean;
}

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
  | "missingTable"
  | "badValue"
  | "unknownZone"
  | "unknownType"
  | "missingPosition"
  | "foreignSheet";

/** One thing wrong with the input, with the cell to select. */
export interface Problem {
  readonly code: ProblemCode;
  readonly message: string;
  readonly sheet: string;
  /** A1 address on that sheet. */
  readonly cell: string;
  readonly mark?: string;
}

export interface TakedownSummary {
  readonly membersByType: Readonly<Record<string, number>>;
  readonly levels: readonly string[];
  /** Total applied load per case (kip or kN). */
  readonly appliedByCase: Readonly<Record<string, number>>;
  /** Total foundation/wall reactions per case. */
  readonly supportsByCase: Readonly<Record<string, number>>;
}

export interface MemberResultJson {
  readonly type: string;
  readonly level: string;
  readonly reactions: Readonly<Record<string, readonly number[]>>;
  readonly shearMax: Readonly<Record<string, number>>;
  readonly momentMax: Readonly<Record<string, number>>;
  readonly tributaryArea: number;
  readonly llrFactor: number;
}

export interface ColumnResultJson {
  readonly level: string;
  readonly cumulative: Readonly<Record<string, number>>;
  readonly tributaryArea: number;
  readonly floors: number;
  readonly kllAt: number;
  readonly llrFactor: number;
  readonly reducedLive: number;
  readonly combos: Readonly<Record<string, number>>;
}

/** The JSON of design.md section 5. */
export interface TakedownJson {
  readonly units: UnitSystem;
  readonly members: Readonly<Record<string, MemberResultJson>>;
  readonly columns: Readonly<Record<string, ColumnResultJson>>;
  readonly foundations: Readonly<Record<string, Readonly<Record<string, number>>>>;
  readonly balance: Readonly<Record<string, { readonly applied: number; readonly supports: number }>>;
  readonly problems: readonly Problem[];
}

/** A member's block on the generated sheet: 0-based first row (its results row) and row count. */
export interface MemberRows {
  readonly row: number;
  readonly rows: number;
}

/**
 * What a written build keeps for the pane's member diagrams: the model and the sheet plan that
 * was written (so computed cells can be read back per member), and each member's rows.
 */
export interface BuiltTakedown {
  readonly model: TakedownModel;
  readonly plan: SheetPlan;
  /** Mark -> its block of rows on the generated sheet (members in the takedown only). */
  readonly rowsByMember: Readonly<Record<string, MemberRows>>;
}

export interface TakedownBuildResult {
  /** False when problems stopped the build (nothing written). */
  readonly ok: boolean;
  readonly problems: readonly Problem[];
  readonly summary?: TakedownSummary;
  readonly json?: TakedownJson;
  /** The generated sheet's name when written. */
  readonly sheet?: string;
  /** The model, plan and member rows of a written takedown (absent when nothing was written). */
  readonly built?: BuiltTakedown;
  /** Members whose results were written as values in native mode, with why. */
  readonly valueOnly?: readonly { readonly mark: string; readonly reason: string }[];
}

/** Progress callback: fraction 0..1 and a short message; awaiting it lets the host breathe. */
export type Progress = (fraction: number, message: string) => void | Promise<void>;

/** Signature of the orchestrator implemented in src/workbook/takedown-build.ts. */
export type BuildTakedown = (port: WorkbookPort, options: TakedownOptions, progress?: Progress) => Promise<TakedownBuildResult>;
