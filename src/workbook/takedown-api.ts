/**
 * The contract between the takedown builder (src/engine/takedown + the orchestrator that runs it
 * over a WorkbookPort) and its callers: the task pane and the `loadpath takedown` command.
 * Shapes of the JSON follow docs/interface.md section 4 exactly.
 */
import type {
  ColumnResult,
  LoadCase,
  MemberResult,
  Problem,
  ProblemCode,
  HeaderRows,
  SheetPlan,
  Summary,
  TableMapping,
  TakedownModel,
  TakedownResults,
  UnitSystem,
} from "../engine/takedown";
import type { WorkbookPort } from "./port";

// The shapes shared with the engine are declared once, in src/engine/takedown (types.ts,
// results.ts, index.ts), and re-exported here under the contract's names.
export type { LoadCase, Problem, ProblemCode, UnitSystem };
export type { ColumnResult as ColumnResultJson, MemberResult as MemberResultJson, Summary as TakedownSummary, TakedownResults as TakedownJson };

/** Column mapping per table (canonical header -> the user's reference); see the engine's TableMapping. */
export type ColumnMapping = TableMapping;

/** Header row per table (1-based sheet row) where the user gives it; see the engine's HeaderRows. */
export type { HeaderRows };

export interface TakedownOptions {
  /** Table name, sheet name (used range) or "Sheet!A1:G20" of each input table. */
  readonly zones: string;
  readonly members: string;
  readonly loads?: string;
  /** Interior supports of continuous members (`Mark | Support | At | Support at`), optional. */
  readonly bearings?: string;
  readonly units: UnitSystem;
  readonly mapping?: ColumnMapping;
  /** Header row of a table (1-based sheet row); a table left out has its header row found. */
  readonly headerRows?: HeaderRows;
  /** Name of the generated sheet (default "Takedown"). */
  readonly sheetName?: string;
  /** Replace a same-named sheet the add-in did not create (only after asking the user). */
  readonly replaceForeign?: boolean;
  /** Hand-off mode: classic spreadsheet functions only, no add-in functions. */
  readonly native?: boolean;
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
  readonly summary?: Summary;
  readonly json?: TakedownResults;
  /** The generated sheet's name when written. */
  readonly sheet?: string;
  /** The model, plan and member rows of a written takedown (absent when nothing was written). */
  readonly built?: BuiltTakedown;
  /**
   * Members whose loads, reactions, shears or moments were written as values in native mode, with
   * why (continuous members, beams under walls, varying loads): what follows them down the path
   * does not update by itself.
   */
  readonly valueOnly?: readonly { readonly mark: string; readonly reason: string }[];
  /** Native mode: members whose governing values and deflection checks (read by nothing else) were written as values. */
  readonly governingValuesOnly?: number;
}

/** Progress callback: fraction 0..1 and a short message; awaiting it lets the host breathe. */
export type Progress = (fraction: number, message: string) => void | Promise<void>;

/** Signature of the orchestrator implemented in src/workbook/takedown-build.ts. */
export type BuildTakedown = (port: WorkbookPort, options: TakedownOptions, progress?: Progress) => Promise<TakedownBuildResult>;
