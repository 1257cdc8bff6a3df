/* Task pane entry. The functions bundle is loaded on the same page (shared runtime). */
const CAUTION =
  "Results need review by a qualified engineer; local codes govern.";

function render(connected: boolean): void {
  const root = document.getElementById("root");
  if (!root) return;
  root.textContent = "";
  const h = document.createElement("h1");
  h.textContent = "Loadpath";
  const p = document.createElement("p");
  p.textContent = connected
    ? "LOADPATH worksheet functions are ready in this workbook."
    : "Not connected to Excel.";
  const c = document.createElement("p");
  c.textContent = CAUTION;
  root.append(h, p, c);
}

if (typeof Office !== "undefined" && typeof Office.onReady === "function") {
  void Office.onReady((info) => render(info.host === Office.HostType.Excel));
} else {
  render(false);
}
