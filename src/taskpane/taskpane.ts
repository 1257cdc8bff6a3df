/*
 * Task pane entry of the Excel bundle (dist/taskpane.js). The functions bundle is loaded on the
 * same page (shared runtime). This bundle talks to the workbook only through the Office.js
 * adapter and must never include HyperFormula (DEVELOPERS.md, Rules every change keeps).
 */
import { OfficeWorkbookPort } from "../workbook/office";
import { buildTakedown } from "../workbook/takedown-build";
import { mountPane, showStartupError } from "./mount";

function start(connected: boolean): void {
  const root = document.getElementById("root");
  if (!root) return;
  if (!connected) {
    showStartupError(root, "Not connected to Excel. Open this pane from Excel, or try the demo page (pane-demo.html) in a browser.");
    return;
  }
  mountPane(root, { port: new OfficeWorkbookPort(), build: buildTakedown, connected: true });
}

if (typeof Office !== "undefined" && typeof Office.onReady === "function") {
  void Office.onReady((info) => start(info.host === Office.HostType.Excel));
} else {
  start(false);
}
