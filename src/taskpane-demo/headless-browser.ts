/**
 * The browser stand-in for src/workbook/headless.ts on the demo page (webpack.config.js swaps it
 * in for the memory port's import): the same exports, but engines are built from the bundle the
 * page registered (register.ts) instead of reading dist/ from disk, which a page cannot do.
 */
import { HyperFormula } from "hyperformula";
import { defineBooleans, HEADLESS_CONFIG, NAMESPACE, toEngineContent, type LoadedBundle } from "../workbook/headless-plugin";
import type { Headless, HeadlessOptions } from "../workbook/headless";

export * from "../workbook/headless-plugin";
export type { Headless, HeadlessOptions } from "../workbook/headless";


let pageBundle: LoadedBundle | null = null;

/** Record the bundle registered in this page (register.ts calls it). */
export function usePageBundle(bundle: LoadedBundle): void {
  pageBundle = bundle;
}

/** The page has no dist folder; the stand-in's registerLoadpathFunctions ignores the folder given. */
export function defaultDistDir(): string {
  return "";
}

/** The bundle this page registered (the folder argument is ignored in the page). */
export function registerLoadpathFunctions(_distDir?: string): LoadedBundle {
  if (!pageBundle) throw new Error("The LOADPATH functions are not registered in this page yet.");
  return pageBundle;
}

/** A HyperFormula instance with the page's LOADPATH functions (the distDir option is ignored). */
export async function createHeadless(options: HeadlessOptions = {}): Promise<Headless> {
  if (!pageBundle) throw new Error("The LOADPATH functions are not registered in this page yet.");
  const sheets = Object.fromEntries(Object.entries(options.sheets ?? {}).map(([name, rows]) => [name, rows.map((r) => r.map(toEngineContent))]));
  const config = { ...HEADLESS_CONFIG, ...options.config };
  const hf = Object.keys(sheets).length > 0 ? HyperFormula.buildFromSheets(sheets, config) : HyperFormula.buildEmpty(config);
  defineBooleans(hf);
  return { hf, bundle: pageBundle, functionIds: pageBundle.metadata.map((f) => `${NAMESPACE}.${f.id.toUpperCase()}`) };
}
