/**
 * The demo page's workbook: the sample JSON loaded into HyperFormula (with the LOADPATH functions
 * registered from the built bundle by register.ts) behind the in-memory workbook port.
 */
import { HyperFormula, type RawCellContent } from "hyperformula";
import { defineBooleans, NAMESPACE, toEngineContent, type LoadedBundle } from "../workbook/headless-plugin";
import { MemoryWorkbookPort, SHEET_LIMITS } from "../workbook/memory-port";
import { mistakesOf, type SampleJson } from "./sample-data";

export { SAMPLE_FILE } from "./sample-data";

/** The headless engine configuration (HyperFormula under GPL-3.0). */
const CONFIG = { licenseKey: "gpl-v3", language: "enGB", ...SHEET_LIMITS } as const;

/** Fetch the sample workbook made at build time. */
export async function loadSample(url: string): Promise<SampleJson> {
  const response = await fetch(url);
  if (!response.ok) throw new Error(`${url} could not be loaded (${response.status}); was "npm run build" run?`);
  return (await response.json()) as SampleJson;
}

/** The sample with an unknown support and a cycle planted in its members table. */
export function withMistakes(sample: SampleJson): SampleJson {
  return mistakesOf(sample).sample;
}

/**
 * The sample as an in-memory workbook behind the port.
 * @param bundle - the functions bundle registered in this page.
 */
export function openSample(sample: SampleJson, bundle: LoadedBundle): MemoryWorkbookPort {
  const sheets: Record<string, RawCellContent[][]> = {};
  for (const s of sample.sheets) sheets[s.name] = s.rows.map((r) => r.map((c) => toEngineContent(c)));
  const hf = HyperFormula.buildFromSheets(sheets, CONFIG);
  defineBooleans(hf);
  const functionIds = bundle.metadata.map((f) => `${NAMESPACE}.${f.id.toUpperCase()}`);
  return new MemoryWorkbookPort({ hf, bundle, functionIds }, sample.tables);
}
