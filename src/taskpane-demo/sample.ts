/**
 * The demo page's workbook: the sample JSON loaded into HyperFormula (with the LOADPATH functions
 * registered from the built bundle by register.ts) behind the in-memory workbook port.
 */
import type { RawCellContent } from "hyperformula";
import type { LoadedBundle } from "../workbook/headless-plugin";
import { MemoryWorkbookPort } from "../workbook/memory-port";
import { mistakesOf, type SampleJson } from "./sample-data";

export { SAMPLE_FILE, SAMPLE_FILE_SI, SAMPLE_FILE_TWO_STOREY } from "./sample-data";

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
 * The sample as an in-memory workbook behind the port (engines come from the page's registered
 * bundle: headless-browser.ts stands in for headless.ts in this page's build).
 * @param _bundle - the functions bundle registered in this page (registration must come first).
 */
export async function openSample(sample: SampleJson, _bundle: LoadedBundle): Promise<MemoryWorkbookPort> {
  const sheets: Record<string, RawCellContent[][]> = {};
  for (const s of sample.sheets) sheets[s.name] = s.rows.map((r) => [...r]);
  return MemoryWorkbookPort.create({ sheets, tables: sample.tables });
}
