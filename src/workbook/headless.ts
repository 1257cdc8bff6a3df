/**
 * The headless evaluator: HyperFormula with the LOADPATH functions registered from the BUILT
 * bundle (dist/functions.js + dist/functions.json), loaded the way Excel loads them: the bundle
 * runs with its own `CustomFunctions` (a shim that records each `associate` call), and
 * the metadata decides each function's parameters and whether it spills. A mismatch between the
 * two (an id without a function, a function without an id, a spilling result without a spill
 * rule) makes loading fail with a message, rather than leaving #NAME? in a user's cell.
 *
 * HyperFormula is used under GPL-3.0 (licence key "gpl-v3"); this module is for Node (CLI,
 * tests, benchmarks) and must never be imported by the add-in bundle.
 */
import { existsSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { compileFunction } from "node:vm";
import { HyperFormula, type ConfigParams, type RawCellContent } from "hyperformula";
import { createCustomFunctionsShim } from "./headless-shim";

export { HEADLESS_CONFIG } from "./headless-plugin";
import { bundleMismatches, defineBooleans, HEADLESS_CONFIG, NAMESPACE, registerBundle, toEngineContent, toEngineFormula, type BundleFunction, type FunctionMetadata, type LoadedBundle } from "./headless-plugin";

export * from "./headless-plugin";

/** Raised when the built bundle is missing or does not match its metadata. */
export class BundleLoadError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "BundleLoadError";
  }
}

/**
 * Where the built bundle is: `LOADPATH_DIST` when set, else the folder of this code when it runs
 * from dist/cli.js, else the repository's dist/ when it runs from source (tests, benchmarks).
 */
export function defaultDistDir(): string {
  if (process.env.LOADPATH_DIST) return resolve(process.env.LOADPATH_DIST);
  const candidates = [__dirname, resolve(__dirname, "..", "..", "dist"), resolve(process.cwd(), "dist")];
  return candidates.find((d) => existsSync(join(d, "functions.json"))) ?? candidates[1]!;
}

function readMetadata(distDir: string): FunctionMetadata[] {
  const file = join(distDir, "functions.json");
  if (!existsSync(file)) throw new BundleLoadError(`${file} is missing: run "npm run build" first.`);
  const parsed = JSON.parse(readFileSync(file, "utf8")) as { functions?: FunctionMetadata[] };
  if (!Array.isArray(parsed.functions)) throw new BundleLoadError(`${file} has no "functions" list.`);
  return parsed.functions;
}

/**
 * Run the bundle and collect what it associates. The bundle's code is compiled as the body of a
 * function whose parameters stand for the host globals it may use (`CustomFunctions`, `self`,
 * `window`), so its associations go to a fresh shim and nothing leaks into this process's
 * globals. It is not run in a separate vm context: every global a function reads there (Math,
 * Number, Array...) goes through the context's interceptors, which cost about 5 µs per call of a
 * beam function, more than the mechanics (measured: 6.3 against 1.2 µs per call).
 */
function runBundle(distDir: string): { functions: Map<string, BundleFunction>; problems: string[] } {
  const file = join(distDir, "functions.js");
  if (!existsSync(file)) throw new BundleLoadError(`${file} is missing: run "npm run build" first.`);
  const shim = createCustomFunctionsShim();
  const scope: Record<string, unknown> = { CustomFunctions: shim.global, console, setTimeout, clearTimeout, queueMicrotask };
  scope.self = scope;
  scope.window = scope;
  try {
    compileFunction(readFileSync(file, "utf8"), ["CustomFunctions", "self", "window"], { filename: file })(shim.global, scope, scope);
  } catch (e) {
    throw new BundleLoadError(`${file} failed to load: ${e instanceof Error ? e.message : String(e)}`);
  }
  return { functions: shim.associated, problems: shim.problems };
}

/**
 * Load the built functions bundle and check it against its metadata.
 * @param distDir - folder holding functions.js and functions.json (default {@link defaultDistDir}).
 * @throws BundleLoadError naming every mismatch, or a missing build.
 */
export function loadFunctionsBundle(distDir: string = defaultDistDir()): LoadedBundle {
  const metadata = readMetadata(distDir);
  const { functions, problems } = runBundle(distDir);
  const all = [...problems, ...bundleMismatches(metadata, functions)];
  if (all.length > 0) throw new BundleLoadError(`The functions bundle in ${distDir} does not match its metadata:\n  ${all.join("\n  ")}`);
  return { distDir, metadata, functions };
}

let registered: LoadedBundle | null = null;

/**
 * Load the bundle and register its functions with HyperFormula (once per process and folder;
 * instances built afterwards see them). Translations for enGB and enUS keep the names as typed.
 * @param distDir - folder of the built bundle (default {@link defaultDistDir}).
 * @throws BundleLoadError when the bundle is missing or does not match its metadata.
 */
export function registerLoadpathFunctions(distDir: string = defaultDistDir()): LoadedBundle {
  if (registered && registered.distDir === distDir) return registered;
  const bundle = loadFunctionsBundle(distDir);
  registerBundle(bundle);
  registered = bundle;
  return bundle;
}

/** A HyperFormula instance with the LOADPATH functions, and the bundle they came from. */
export interface Headless {
  readonly hf: HyperFormula;
  readonly bundle: LoadedBundle;
  /** Function ids with the namespace, e.g. "LOADPATH.MOMENT_MAX". */
  readonly functionIds: readonly string[];
}

/** Options of {@link createHeadless}. */
export interface HeadlessOptions {
  /** Folder of the built bundle (default {@link defaultDistDir}). */
  readonly distDir?: string;
  /**
   * Sheets to start with: name -> rows of values and formulas ("=LOADPATH.MOMENT_MAX(...)";
   * file spellings such as `_xldudf_LOADPATH_MOMENT_MAX(` are translated).
   */
  readonly sheets?: Readonly<Record<string, RawCellContent[][]>>;
  /** Extra HyperFormula configuration. */
  readonly config?: Partial<ConfigParams>;
  /** Workbook names to define (a file's defined names): name -> what it refers to ("Sheet1!$B$1"). */
  readonly names?: readonly DefinedName[];
}

/** A workbook-level defined name: `Span` referring to `Sheet1!$B$1`. */
export interface DefinedName {
  readonly name: string;
  /** What it refers to, in the engine's spelling, without "=". */
  readonly refersTo: string;
}

/**
 * Define workbook names in an engine; a name the engine cannot take (one that reads as a cell
 * address, say) is left out, so formulas using it show #NAME? and are listed by the caller.
 * @param hf - the engine
 * @param names - the names
 * @returns the names left out
 */
export function defineNames(hf: HyperFormula, names: readonly DefinedName[]): string[] {
  const skipped: string[] = [];
  for (const n of names) {
    const expression = `=${toEngineFormula(n.refersTo)}`;
    try {
      if (hf.isItPossibleToAddNamedExpression(n.name, expression)) hf.addNamedExpression(n.name, expression);
      else skipped.push(n.name);
    } catch {
      skipped.push(n.name);
    }
  }
  return skipped;
}

/**
 * Create a headless engine with the LOADPATH functions registered from the built bundle.
 * Bare TRUE and FALSE are defined as names (HyperFormula knows only TRUE() and FALSE()).
 * @example
 * const { hf } = await createHeadless({ sheets: { S: [[20, "=LOADPATH.MOMENT_MAX(A1, 1.5)"]] } });
 * hf.getCellValue({ sheet: 0, row: 0, col: 1 }); // 75
 */
export async function createHeadless(options: HeadlessOptions = {}): Promise<Headless> {
  const bundle = registerLoadpathFunctions(options.distDir ?? defaultDistDir());
  const sheets = Object.fromEntries(Object.entries(options.sheets ?? {}).map(([name, rows]) => [name, rows.map((r) => r.map(toEngineContent))]));
  const config = { ...HEADLESS_CONFIG, ...options.config };
  const hf = Object.keys(sheets).length > 0 ? HyperFormula.buildFromSheets(sheets, config) : HyperFormula.buildEmpty(config);
  defineBooleans(hf);
  if (options.names && options.names.length > 0) defineNames(hf, options.names);
  return { hf, bundle, functionIds: bundle.metadata.map((f) => `${NAMESPACE}.${f.id.toUpperCase()}`) };
}

