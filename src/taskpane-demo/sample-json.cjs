/*
 * Build step of the demo page (run by webpack.config.js, in Node): a sample .xlsx -> JSON the
 * page loads without a spreadsheet reader in the browser. Formulas keep their "=", tables keep
 * their name and A1 extent. Generated output, never edited by hand.
 */
const ExcelJS = require("exceljs");

/** A cell's content as the demo needs it: a value, or "=formula", or null when blank. */
function content(cell) {
  const v = cell.value;
  if (v === null || v === undefined) return null;
  if (typeof v === "object") {
    if (cell.formula) return "=" + cell.formula;
    if (v instanceof Date) return v.toISOString().slice(0, 10);
    if ("richText" in v) return v.richText.map((t) => t.text).join("");
    if ("text" in v) return v.text;
    if ("error" in v) return v.error;
    return null;
  }
  return v;
}

/**
 * @param {Buffer} buffer the .xlsx file
 * @returns {Promise<string>} JSON text: { sheets: [{ name, rows }], tables: [{ name, sheet, ref }] }
 */
async function xlsxToJson(buffer) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(buffer);
  const sheets = [];
  const tables = [];
  wb.eachSheet((ws) => {
    const rows = [];
    ws.eachRow({ includeEmpty: true }, (row, r) => {
      const out = [];
      row.eachCell({ includeEmpty: true }, (cell, c) => {
        out[c - 1] = content(cell);
      });
      rows[r - 1] = Array.from(out, (x) => (x === undefined ? null : x));
    });
    sheets.push({ name: ws.name, rows: Array.from(rows, (r) => r || []) });
    for (const t of ws.getTables ? ws.getTables() : []) {
      const table = t.table || t;
      tables.push({ name: table.name, sheet: ws.name, ref: table.tableRef || table.ref });
    }
  });
  return JSON.stringify({ generated: "by src/taskpane-demo/sample-json.cjs from the sample workbook", sheets, tables });
}

module.exports = { xlsxToJson };
