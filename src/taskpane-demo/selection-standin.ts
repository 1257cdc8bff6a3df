/**
 * The demo page's stand-in for Excel's selection: the page has no grid, so a small labelled
 * panel lets the user make a cell active as if they clicked it in Excel (a row of the Members
 * table, or any cell such as a row of the generated takedown sheet). The in-memory workbook then
 * tells the pane, as Excel's selection event would. Built with DOM calls and textContent only.
 */
import { cellAddress } from "../workbook/a1";
import { columnOf, membersTableOf, type SampleJson } from "./sample-data";

/** What the stand-in moves: the in-memory workbook's active cell. */
export interface ActiveCellTarget {
  setActiveCell(sheet: string, address: string): void;
}

/** "Sheet!A1", "'My sheet'!B7" -> sheet and address; null when it is not that form. */
export function parseCellRef(text: string): { sheet: string; address: string } | null {
  const m = /^\s*(?:'((?:[^']|'')+)'|([^!']+))!\s*\$?([A-Za-z]{1,3})\$?(\d+)\s*$/.exec(text);
  if (!m || Number(m[4]) < 1) return null;
  return { sheet: m[1] !== undefined ? m[1].replace(/''/g, "'") : m[2]!.trim(), address: `${m[3]!.toUpperCase()}${m[4]}` };
}

function el<K extends keyof HTMLElementTagNameMap>(tag: K, props: Partial<Record<string, string>> = {}, text?: string): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(props)) if (v !== undefined) e.setAttribute(k, v);
  if (text !== undefined) e.textContent = text;
  return e;
}

/**
 * The stand-in panel for a sample workbook.
 * @param sample - the sample (its Members table rows are listed)
 * @param target - the workbook whose active cell moves
 */
export function selectionStandIn(sample: SampleJson, target: ActiveCellTarget): HTMLElement {
  const box = el("section", { class: "demo-standin", "aria-labelledby": "standin-title", "data-testid": "demo-standin" });
  box.append(el("h2", { id: "standin-title" }, "Excel’s selection (demo stand-in)"));
  box.append(el("p", {}, "No grid on this page: pick a cell as if you clicked it in Excel."));
  const table = membersTableOf(sample);
  const markCol = columnOf(table, "Mark");
  const rowLabel = el("label", { for: "standin-row" }, "Members row");
  const select = el("select", { id: "standin-row", "data-testid": "demo-member-row" });
  select.append(el("option", { value: "" }, "Pick a row"));
  table.body.forEach((row, i) => {
    const mark = row[markCol];
    if (mark === null || mark === undefined || mark === "") return;
    const ref = `${table.sheet}!${cellAddress(table.top + 1 + i, table.left + markCol)}`;
    select.append(el("option", { value: ref }, `${ref} · ${String(mark)}`));
  });
  const move = (ref: string): boolean => {
    const cell = parseCellRef(ref);
    if (!cell) return false;
    target.setActiveCell(cell.sheet, cell.address);
    return true;
  };
  select.addEventListener("change", () => {
    if (select.value !== "") move(select.value);
  });
  const cellLabel = el("label", { for: "standin-cell" }, "Or any cell");
  const input = el("input", { id: "standin-cell", type: "text", placeholder: "Takedown!A12", "data-testid": "demo-cell", autocomplete: "off", spellcheck: "false" });
  const go = el("button", { type: "button", "data-testid": "demo-select-cell" }, "Select");
  const note = el("span", { class: "standin-msg", role: "status", "aria-live": "polite", "data-testid": "demo-cell-msg" });
  const submit = (): void => {
    note.textContent = move(input.value) ? "" : "Type a cell as Sheet!A1.";
  };
  go.addEventListener("click", submit);
  input.addEventListener("keydown", (e) => {
    if (e.key === "Enter") submit();
  });
  const line1 = el("div", { class: "standin-line" });
  line1.append(rowLabel, select);
  const line2 = el("div", { class: "standin-line" });
  line2.append(cellLabel, input, go, note);
  box.append(line1, line2);
  return box;
}
