/*
 * The demo page (dist/pane-demo.html): the task pane outside Excel, over the in-memory
 * workbook (HyperFormula with the built LOADPATH functions) holding a sample building. It says
 * it is not connected to Excel; settings live in the browser's localStorage; the cell a problem
 * selects is shown under the notice, since there is no grid to select it in.
 * `?sample=mistakes` loads the same building with an unknown support and a cycle; `?sample=timber`
 * the SI sample (a timber house), `?sample=two-storey` the two-storey SI house (continuous joists
 * from a Bearings table, stacked walls). A labelled panel stands in for Excel's selection.
 */
import { mountPane, showStartupError } from "../taskpane/mount";
import type { WorkbookPort } from "../workbook/port";
import { buildTakedown } from "../workbook/takedown-build";
import { withStoredSettings } from "./local-settings";
import { registerFunctionsInPage } from "./register";
import { loadSample, openSample, SAMPLE_FILE, SAMPLE_FILE_SI, SAMPLE_FILE_TWO_STOREY, withMistakes } from "./sample";
import { selectionStandIn } from "./selection-standin";

type Variant = "building" | "mistakes" | "timber" | "two-storey";

function variantOf(search: string): Variant {
  const v = new URLSearchParams(search).get("sample");
  return v === "mistakes" || v === "timber" || v === "two-storey" ? v : "building";
}

/** Record the cell each selection goes to, and show it on the page. */
function showingSelection(port: WorkbookPort, out: HTMLElement): WorkbookPort {
  return {
    ...port,
    select: async (sheet, address) => {
      await port.select(sheet, address);
      out.textContent = `Cell selected in the sample workbook: ${sheet}!${address}`;
      out.dataset.cell = `${sheet}!${address}`;
    },
  };
}

async function start(): Promise<void> {
  const root = document.getElementById("root");
  if (!root) return;
  const selected = document.createElement("p");
  selected.className = "demo-note";
  selected.setAttribute("aria-live", "polite");
  selected.dataset.testid = "demo-selected";
  try {
    const variant = variantOf(location.search);
    const file = variant === "timber" ? SAMPLE_FILE_SI : variant === "two-storey" ? SAMPLE_FILE_TWO_STOREY : SAMPLE_FILE;
    const [bundle, loaded] = await Promise.all([registerFunctionsInPage(), loadSample(`samples/${file}`)]);
    const sample = variant === "mistakes" ? withMistakes(loaded) : loaded;
    const port = await openSample(sample, bundle);
    const prefix = `loadpath-demo:${variant}:`;
    // The SI samples open in SI units until the user picks otherwise.
    if ((variant === "timber" || variant === "two-storey") && window.localStorage.getItem(`${prefix}loadpath.units`) === null) window.localStorage.setItem(`${prefix}loadpath.units`, "SI");
    const stored = withStoredSettings(port, window.localStorage, prefix);
    root.before(selectionStandIn(sample, port), selected);
    mountPane(root, { port: showingSelection(stored, selected), build: buildTakedown, connected: false });
  } catch (e) {
    showStartupError(root, `The demo could not start: ${e instanceof Error ? e.message : String(e)}`);
  }
}

void start();
