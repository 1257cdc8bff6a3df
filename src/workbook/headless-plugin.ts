/**
 * The LOADPATH functions as a HyperFormula plugin, built from a loaded functions bundle (its
 * metadata and the functions it associated). Browser-safe: no Node modules, so the headless
 * evaluator (headless.ts, Node) and a web page that runs the bundle as a script share it.
 *
 * Each metadata entry becomes `LOADPATH.<ID>` with every parameter passed as Excel passes it to
 * a custom function: a matrix parameter gets the raw 2-D array of values (a scalar becomes
 * [[scalar]]), a scalar parameter the value, a parameter left out `null`; blank cells `null`,
 * error cells a `CustomFunctions.Error`-like object. A returned `CustomFunctions.Error` becomes a
 * CellError carrying its message; a spilled result is fitted to the size spill.ts predicts from
 * the argument sizes (padded with ""); an exception becomes a #VALUE! with its message.
 */
import {
  AlwaysDense,
  AlwaysSparse,
  ArraySize,
  CellError,
  EmptyValue,
  ErrorType,
  FunctionArgumentType,
  FunctionPlugin,
  HyperFormula,
  SimpleRangeValue,
  type ConfigParams,
  type FunctionPluginDefinition,
  type ImplementedFunctions,
  type RawCellContent,
} from "hyperformula";
import { enUS } from "hyperformula/i18n/languages";
import { padToSize, spillSize, type ArgShape } from "../functions/spill";
import { ShimError } from "./headless-shim";

/** The add-in's function namespace (manifest and docs/interface.md section 1). */
export const NAMESPACE = "LOADPATH";

/** One parameter as functions.json describes it. */
export interface ParameterMetadata {
  readonly name: string;
  readonly description?: string;
  readonly type?: string;
  readonly dimensionality?: "scalar" | "matrix";
  readonly optional?: boolean;
  readonly repeating?: boolean;
}

/** One function as functions.json describes it. */
export interface FunctionMetadata {
  readonly id: string;
  readonly name: string;
  readonly description?: string;
  readonly parameters: readonly ParameterMetadata[];
  readonly result: { readonly type?: string; readonly dimensionality?: "scalar" | "matrix" };
}

/** A function as the bundle associated it. */
export type BundleFunction = (...args: unknown[]) => unknown;

/** The functions bundle as loaded: its metadata and the functions it associated, by id. */
export interface LoadedBundle {
  readonly distDir: string;
  readonly metadata: readonly FunctionMetadata[];
  readonly functions: ReadonlyMap<string, BundleFunction>;
}

/**
 * Everything wrong between the metadata and the associations, one line each (empty when they
 * match): an id without a function, a function without an id, an id listed twice, a spilled
 * result without a spill rule, a repeating parameter.
 * @param metadata - the functions of functions.json.
 * @param functions - what the bundle associated, by upper-case id.
 */
export function bundleMismatches(metadata: readonly FunctionMetadata[], functions: ReadonlyMap<string, BundleFunction>): string[] {
  const out: string[] = [];
  const ids = new Set<string>();
  for (const f of metadata) {
    const id = f.id.toUpperCase();
    if (ids.has(id)) out.push(`functions.json lists ${f.id} twice.`);
    ids.add(id);
    if (!functions.has(id)) out.push(`functions.json lists ${f.id} but functions.js associates no function with it (is its source file imported by src/functions/functions.ts?).`);
    if (f.result.dimensionality === "matrix" && spillSize(id, []) === undefined) {
      out.push(`${f.id} returns a spilled range but src/functions/spill.ts has no spill rule for it (the headless engine must know its size before evaluating).`);
    }
    if (f.parameters.some((p) => p.repeating)) out.push(`${f.id} has a repeating parameter, which the headless evaluator does not support.`);
  }
  for (const id of functions.keys()) if (!ids.has(id)) out.push(`functions.js associates ${id} but functions.json has no entry for it (is the file in FUNCTION_SOURCES of webpack.config.js?).`);
  return out;
}

/** Excel error text by HyperFormula error type (types Excel lacks read as #VALUE!). */
const EXCEL_ERROR_OF_TYPE: Readonly<Record<string, string>> = {
  [ErrorType.DIV_BY_ZERO]: "#DIV/0!",
  [ErrorType.NA]: "#N/A",
  [ErrorType.NAME]: "#NAME?",
  [ErrorType.NUM]: "#NUM!",
  [ErrorType.REF]: "#REF!",
  [ErrorType.VALUE]: "#VALUE!",
  [ErrorType.SPILL]: "#SPILL!",
};

const TYPE_OF_EXCEL_ERROR: Readonly<Record<string, ErrorType>> = {
  "#DIV/0!": ErrorType.DIV_BY_ZERO,
  "#N/A": ErrorType.NA,
  "#NAME?": ErrorType.NAME,
  "#NUM!": ErrorType.NUM,
  "#REF!": ErrorType.REF,
  "#VALUE!": ErrorType.VALUE,
};

/**
 * The Excel error text for a HyperFormula error type, for cached results in files.
 * @param type - HyperFormula's error type.
 */
export function excelErrorText(type: ErrorType): string {
  return EXCEL_ERROR_OF_TYPE[type] ?? "#VALUE!";
}

/** A value inside HyperFormula -> what a custom function receives. */
function toHostCell(v: unknown): unknown {
  if (typeof v === "number") return v;
  if (v === EmptyValue || v === undefined || v === null) return null;
  if (v instanceof CellError) return new ShimError(excelErrorText(v.type), v.message);
  if (typeof v === "object" && "val" in (v as object)) return (v as { val: unknown }).val; // a number with a format (date, percent)
  return v;
}

function toHostArgument(v: unknown, matrix: boolean): unknown {
  if (v instanceof SimpleRangeValue) {
    const data = v.data;
    if (!matrix && data.length === 1 && data[0]!.length === 1) return toHostCell(data[0]![0]);
    // Plain loops: a takedown passes ~10^5 ranges.
    const grid = new Array<unknown[]>(data.length);
    for (let i = 0; i < data.length; i++) {
      const row = data[i]!;
      const out = new Array<unknown>(row.length);
      for (let j = 0; j < row.length; j++) out[j] = toHostCell(row[j]);
      grid[i] = out;
    }
    return grid;
  }
  if (v === undefined) return null; // an optional argument left out
  const cell = toHostCell(v);
  return matrix ? [[cell]] : cell;
}

/** A value a custom function returned (one cell) -> HyperFormula. */
function fromHostCell(v: unknown): unknown {
  if (v === null || v === undefined) return EmptyValue;
  if (v instanceof ShimError || (typeof v === "object" && v !== null && typeof (v as { code?: unknown }).code === "string")) {
    const e = v as { code: string; message?: string };
    return new CellError(TYPE_OF_EXCEL_ERROR[e.code] ?? ErrorType.VALUE, e.message);
  }
  if (typeof v === "number") return Number.isFinite(v) ? v : new CellError(ErrorType.NUM, "The result is not a finite number.");
  if (typeof v === "string" || typeof v === "boolean") return v;
  return new CellError(ErrorType.VALUE, `Unexpected result of type ${typeof v}.`);
}

/** Shape of one argument of a formula before evaluation (spill.ts's input). */
type Ast = { type: string; value?: unknown; args?: Ast[] };

/** What every call of one function needs, worked out once when the plugin is built. */
interface CallPlan {
  readonly fm: FunctionMetadata;
  /** "LOADPATH.<ID>". */
  readonly fullId: string;
  readonly fn: BundleFunction;
  /** Per parameter: passed as a 2-D array (a matrix parameter). */
  readonly matrix: readonly boolean[];
  readonly matrixResult: boolean;
}

function callPlanOf(bundle: LoadedBundle, fm: FunctionMetadata): CallPlan {
  return {
    fm,
    fullId: `${NAMESPACE}.${fm.id.toUpperCase()}`,
    fn: bundle.functions.get(fm.id.toUpperCase())!,
    matrix: fm.parameters.map((p) => p.dimensionality === "matrix"),
    matrixResult: fm.result.dimensionality === "matrix",
  };
}

/** The plugin class holding the calls; methods per function are added from the metadata. */
class LoadpathPlugin extends FunctionPlugin {
  /** The bundle whose functions this plugin calls (set on each subclass by pluginFor). */
  static bundle: LoadedBundle | null = null;

  /** Shapes of a call's arguments: ranges by size, typed numbers by value, left out = undefined. */
  shapes(ast: { args: Ast[] }, state: unknown): (ArgShape | undefined)[] {
    return ast.args.map((a) => {
      if (a.type === "EMPTY") return undefined;
      if (a.type === "NUMBER") return { rows: 1, cols: 1, literal: a.value as number };
      if (a.type === "MINUS_UNARY_OP" && a.args === undefined && (a as { value?: Ast }).value?.type === "NUMBER") {
        return { rows: 1, cols: 1, literal: -((a as { value: Ast }).value.value as number) };
      }
      const size = this.arraySizeForAst(a as never, state as never);
      return { rows: size.height, cols: size.width };
    });
  }

  /** Predicted spill size of a call, from its arguments' shapes (spill.ts). */
  spillOf(id: string, ast: { args: Ast[] }, state: unknown): ArraySize {
    const size = spillSize(id, this.shapes(ast, state));
    return size ? new ArraySize(size.cols, size.rows) : ArraySize.scalar();
  }

  /** Evaluate one call: coerce HyperFormula values to what Excel passes, call, convert back. */
  callBundle(plan: CallPlan, ast: { args: Ast[] }, state: unknown): unknown {
    const { fm, fullId, fn, matrix, matrixResult } = plan;
    return this.runFunction(ast.args as never, state as never, this.metadata(fullId), (...args: unknown[]): never => {
      try {
        const hostArgs = new Array<unknown>(matrix.length);
        for (let i = 0; i < matrix.length; i++) hostArgs[i] = toHostArgument(args[i], matrix[i]!);
        const result = fn(...hostArgs);
        return (matrixResult ? this.spillResult(fm, result, ast, state) : this.scalarResult(fm, result)) as never;
      } catch (e) {
        return new CellError(ErrorType.VALUE, `${fullId} failed: ${messageOf(e)}`) as never;
      }
    }) as never;
  }

  private scalarResult(fm: FunctionMetadata, result: unknown): unknown {
    if (Array.isArray(result)) return new CellError(ErrorType.VALUE, `${NAMESPACE}.${fm.id} returned a range but functions.json declares a single value.`);
    return fromHostCell(result);
  }

  private spillResult(fm: FunctionMetadata, result: unknown, ast: { args: Ast[] }, state: unknown): unknown {
    if (!Array.isArray(result)) {
      const one = fromHostCell(result);
      if (one instanceof CellError) return one;
      result = [[result]];
    }
    const predicted = this.spillOf(fm.id.toUpperCase(), ast, state);
    const rows = (result as unknown[][]).map((r) => (Array.isArray(r) ? r : [r]));
    const fitted = padToSize(trimBlankEdges(rows as (number | string)[][]), { rows: predicted.height, cols: predicted.width });
    if (!fitted) {
      return new CellError(
        ErrorType.VALUE,
        `${NAMESPACE}.${fm.id}: the result needs more than the ${predicted.height} x ${predicted.width} cells sized before evaluation (type numbers such as stations directly in the formula).`,
      );
    }
    return SimpleRangeValue.onlyValues(fitted.map((r) => r.map((c) => fromHostCell(c))) as never);
  }
}

/** The message of anything thrown (an Error from the bundle's own realm is not `instanceof Error` here). */
function messageOf(e: unknown): string {
  return typeof e === "object" && e !== null && typeof (e as { message?: unknown }).message === "string" ? (e as { message: string }).message : String(e);
}

/** Drop trailing rows and columns whose cells are all "" or blank (padding). */
function trimBlankEdges(rows: (number | string)[][]): (number | string)[][] {
  const blank = (c: unknown): boolean => c === "" || c === null || c === undefined;
  let h = rows.length;
  while (h > 0 && rows[h - 1]!.every(blank)) h--;
  const kept = rows.slice(0, h);
  const usedWidth = (r: readonly unknown[]): number => {
    for (let i = r.length - 1; i >= 0; i--) if (!blank(r[i])) return i + 1;
    return 0;
  };
  const w = Math.max(0, ...kept.map(usedWidth));
  return kept.map((r) => r.slice(0, w));
}

/**
 * The plugin definition for a loaded bundle: one `LOADPATH.<ID>` entry per metadata function
 * (a fresh plugin class per bundle, so two bundles never share methods).
 * @param bundle - the loaded bundle (metadata checked with {@link bundleMismatches}).
 */
export function pluginFor(bundle: LoadedBundle): FunctionPluginDefinition {
  class BundlePlugin extends LoadpathPlugin {}
  const implemented: ImplementedFunctions = {};
  const proto = BundlePlugin.prototype as unknown as Record<string, unknown>;
  for (const fm of bundle.metadata) {
    const id = fm.id.toUpperCase();
    const method = `call_${id}`;
    const sizeMethod = `size_${id}`;
    implemented[`${NAMESPACE}.${id}`] = {
      method,
      parameters: fm.parameters.map((p) => ({ argumentType: FunctionArgumentType.ANY, ...(p.optional ? { optionalArg: true } : {}) })),
      vectorizationForbidden: true,
      ...(fm.result.dimensionality === "matrix" ? { sizeOfResultArrayMethod: sizeMethod } : {}),
    };
    const plan = callPlanOf(bundle, fm);
    proto[method] = function (this: LoadpathPlugin, ast: { args: Ast[] }, state: unknown) {
      return this.callBundle(plan, ast, state);
    };
    proto[sizeMethod] = function (this: LoadpathPlugin, ast: { args: Ast[] }, state: unknown) {
      return this.spillOf(id, ast, state);
    };
  }
  BundlePlugin.implementedFunctions = implemented;
  BundlePlugin.bundle = bundle;
  return BundlePlugin as unknown as FunctionPluginDefinition;
}

/**
 * Register a loaded bundle's functions with HyperFormula (instances built afterwards see them),
 * with translations for enGB and enUS that keep the names as typed (`LOADPATH.MOMENT_MAX`).
 * @param bundle - the loaded bundle.
 */
export function registerBundle(bundle: LoadedBundle): void {
  if (!HyperFormula.getRegisteredLanguagesCodes().includes("enUS")) HyperFormula.registerLanguage("enUS", enUS);
  const names = Object.fromEntries(bundle.metadata.map((f) => [`${NAMESPACE}.${f.id.toUpperCase()}`, `${NAMESPACE}.${f.id.toUpperCase()}`]));
  HyperFormula.registerFunctionPlugin(pluginFor(bundle), { enGB: names, enUS: names });
}

/**
 * Define bare TRUE and FALSE as names of an engine (HyperFormula knows only TRUE() and FALSE()).
 * @param hf - the engine instance.
 */
export function defineBooleans(hf: HyperFormula): void {
  for (const name of ["TRUE", "FALSE"]) {
    try {
      if (hf.isItPossibleToAddNamedExpression(name, `=${name}()`)) hf.addNamedExpression(name, `=${name}()`);
    } catch {
      // the engine already understands the literal
    }
  }
}

/** Split a formula into pieces outside and inside string literals ("..."), alternating. */
function outsideStrings(formula: string, f: (code: string) => string): string {
  return formula
    .split(/("(?:[^"]|"")*")/)
    .map((piece, i) => (i % 2 === 0 ? f(piece) : piece))
    .join("");
}

/** String literals ("...", quotes doubled inside) and quoted sheet names ('...', apostrophes doubled). */
const QUOTED = /("(?:[^"]|"")*"|'(?:[^']|'')*')/;

/**
 * A number literal with an exponent as Excel writes it (`1E-3`, `1.5E+10`, `2.E+3`), not part of
 * a name or reference (`X1E5`, `$E$3`): the engine reads only a lower-case `e` and no bare point.
 */
const EXPONENT_LITERAL = /(?<![A-Za-z0-9_.$\\])(\d+(?:\.\d*)?|\.\d+)[eE]([+-]?\d+)(?![A-Za-z0-9_(!])/g;

/**
 * An Excel string literal (with its quotes) -> the same text for the engine. The engine's strings
 * take a backslash as an escape and know no doubled quote, so a literal holding `""` or `\` is
 * rebuilt from plain pieces joined with CHAR(34) and CHAR(92): `"say ""hi"""` ->
 * `("say "&CHAR(34)&"hi"&CHAR(34))`.
 */
function engineString(literal: string): string {
  const text = literal.slice(1, -1).replace(/""/g, '"');
  if (!/["\\]/.test(text)) return literal;
  const pieces = text.split(/(["\\])/).filter((p) => p !== "");
  return `(${pieces.map((p) => (p === '"' ? "CHAR(34)" : p === "\\" ? "CHAR(92)" : `"${p}"`)).join("&")})`;
}

/** Parts of a formula that are code (not strings or quoted sheet names) rewritten by `f`; strings by {@link engineString}. */
function rewriteCode(formula: string, f: (code: string) => string): string {
  return formula
    .split(QUOTED)
    .map((piece, i) => (i % 2 === 0 ? f(piece) : piece.startsWith('"') ? engineString(piece) : piece))
    .join("");
}

const FILE_CALL = new RegExp(`_xldudf_${NAMESPACE}_([A-Za-z0-9_]+)\\s*\\(`, "gi");

/**
 * A formula as read from a file -> the spelling the engine parses: `_xldudf_LOADPATH_NAME(` ->
 * `LOADPATH.NAME(` (how Excel stores add-in calls in files), `_xlfn.`/`_xlws.` prefixes removed,
 * exponent literals in the engine's form (`1E-3` -> `1e-3`, `2.E+3` -> `2e+3`), and string
 * literals with doubled quotes or backslashes rebuilt ({@link engineString}). References, quoted
 * sheet names ('It''s'!A1), whole columns and rows, booleans, error literals and percentages are
 * read by the engine as written.
 * @param formula - formula text with or without the leading "=".
 */
export function toEngineFormula(formula: string): string {
  return rewriteCode(formula, (code) =>
    code
      .replace(FILE_CALL, (_m, name: string) => `${NAMESPACE}.${name.toUpperCase()}(`)
      .replace(/_xlfn\.(_xlws\.)?/gi, "")
      .replace(EXPONENT_LITERAL, (_m, mantissa: string, exponent: string) => `${mantissa.replace(/\.$/, "")}e${exponent}`),
  );
}

/** `LOADPATH.` anywhere (a formula without it has nothing to respell). */
const MENTIONS_NAMESPACE = new RegExp(`${NAMESPACE}\\.`, "i");
/** An add-in call in the engine's spelling: `LOADPATH.NAME(`. */
const ENGINE_CALL = new RegExp(`\\b${NAMESPACE}\\.([A-Za-z0-9_]+)\\s*\\(`, "gi");

/**
 * A formula in the engine's (typed) spelling -> the spelling Excel itself writes in .xlsx files
 * for add-in functions: `LOADPATH.NAME(` -> `_xldudf_LOADPATH_NAME(`. Excel maps it back to the
 * add-in's function when the add-in is loaded and shows the cached value meanwhile.
 * @param formula - formula text without the leading "=".
 */
export function toFileFormula(formula: string): string {
  // Most formulas of a generated sheet call no add-in function: left as they are, without splitting.
  if (!MENTIONS_NAMESPACE.test(formula)) return formula;
  const respell = (code: string): string => code.replace(ENGINE_CALL, (_m, name: string) => `_xldudf_${NAMESPACE}_${name.toUpperCase()}(`);
  return formula.includes('"') ? outsideStrings(formula, respell) : respell(formula);
}


/** True when a formula calls a LOADPATH function (in either spelling). */
export function callsLoadpath(formula: string): boolean {
  return new RegExp(`(\\b${NAMESPACE}\\.|_xldudf_${NAMESPACE}_)[A-Za-z0-9_]+\\s*\\(`, "i").test(formula);
}

/** A cell's content for the engine: formulas translated to the engine's spelling. */
export function toEngineContent(content: RawCellContent): RawCellContent {
  return typeof content === "string" && content.startsWith("=") ? "=" + toEngineFormula(content.slice(1)) : content;
}

/**
 * How the engine holds a sheet: as a grid (its default, fastest) unless at most one cell in a
 * thousand of the sheet's extent holds anything; an empty sheet stays a grid as before.
 */
class GridUnlessNearlyBlank {
  private readonly grid = new AlwaysDense();
  private readonly sparse = new AlwaysSparse();
  call(fill: number): ReturnType<AlwaysDense["call"]> | ReturnType<AlwaysSparse["call"]> {
    return fill > 0 && fill <= 0.001 ? this.sparse.call() : this.grid.call();
  }
}

/**
 * The engine configuration used everywhere headless. Smart rounding is off: HyperFormula would
 * round every output to 10 significant digits, while Excel keeps the full double in the cell
 * (and in the file) and only rounds what it displays.
 */
export const HEADLESS_CONFIG: Partial<ConfigParams> = {
  licenseKey: "gpl-v3",
  language: "enGB",
  smartRounding: false,
  // Range arithmetic element by element, as Excel, LibreOffice Calc and Gnumeric evaluate the
  // arguments of SUMPRODUCT: the hand-off takedown's formulas rely on it (src/engine/native).
  useArrayArithmetic: true,
  // A sheet is held as a grid unless almost all of its extent is blank (one stray value in
  // XFD1048576 beside a small table): then only its filled cells are kept, or the grid of
  // 1,048,576 x 16,384 cells would exhaust the heap. Real tables and generated sheets stay grids.
  chooseAddressMappingPolicy: new GridUnlessNearlyBlank(),
};
