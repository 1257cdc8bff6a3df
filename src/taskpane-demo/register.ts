/**
 * The LOADPATH functions in the browser for the demo page, loaded the way Excel loads them: the
 * page installs a `CustomFunctions` stand-in, runs the built dist/functions.js as a script (the
 * very bundle Excel runs), reads dist/functions.json, and registers what was associated into
 * HyperFormula with the browser-safe plugin builder of the headless evaluator
 * (src/workbook/headless-plugin.ts).
 * No eval: the bundle is a plain <script> from the same origin.
 */
import { createCustomFunctionsShim } from "../workbook/headless-shim";
import { bundleMismatches, registerBundle, type FunctionMetadata, type LoadedBundle } from "../workbook/headless-plugin";
import { usePageBundle } from "./headless-browser";

/** Run a same-origin script and wait for it. */
function runScript(src: string): Promise<void> {
  return new Promise((resolve, reject) => {
    const script = document.createElement("script");
    script.src = src;
    script.onload = () => resolve();
    script.onerror = () => reject(new Error(`${src} could not be loaded (was "npm run build" run?).`));
    document.head.append(script);
  });
}

let loaded: Promise<LoadedBundle> | null = null;

/**
 * Load the built functions bundle into this page and register it with HyperFormula (once).
 * @param base - URL folder of functions.js and functions.json ("" = the page's folder).
 * @throws Error naming what is missing or mismatched.
 */
export function registerFunctionsInPage(base = ""): Promise<LoadedBundle> {
  loaded ??= (async () => {
    const shim = createCustomFunctionsShim();
    (globalThis as Record<string, unknown>).CustomFunctions = shim.global;
    await runScript(`${base}functions.js`);
    const response = await fetch(`${base}functions.json`);
    if (!response.ok) throw new Error(`functions.json could not be loaded (${response.status}).`);
    const metadata = ((await response.json()) as { functions: FunctionMetadata[] }).functions;
    const problems = [...shim.problems, ...bundleMismatches(metadata, shim.associated)];
    if (problems.length > 0) throw new Error(`The functions bundle does not match its metadata: ${problems.join(" ")}`);
    const bundle: LoadedBundle = { distDir: base || "(page)", metadata, functions: shim.associated };
    registerBundle(bundle);
    usePageBundle(bundle);
    return bundle;
  })();
  return loaded;
}
