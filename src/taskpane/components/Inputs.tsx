/** Choosing the input tables, matching their columns, and the unit system. */
import * as React from "react";
import { Accordion, AccordionHeader, AccordionItem, AccordionPanel, Field, Input, Radio, RadioGroup, Select, Text, makeStyles, tokens } from "@fluentui/react-components";
import type { TableInfo } from "../../workbook/port";
import type { ColumnMapping, HeaderRows, UnitSystem } from "../../workbook/takedown-api";
import { blockingColumns, OPTIONAL_ROLES, ROLES, ROLE_TITLES, type HeaderCell, type TableReport, type TableRole } from "../schema";
import type { TableChoice } from "../session";

const useStyles = makeStyles({
  stack: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalM },
  columns: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalS },
  note: { color: tokens.colorNeutralForeground3 },
});

function tableLabel(t: TableInfo): string {
  return t.kind === "table" ? `${t.name} (table on ${t.sheet})` : `${t.sheet} (whole sheet)`;
}

/** Props of {@link TablePicker}. */
export interface TablePickerProps {
  readonly tables: readonly TableInfo[];
  readonly choice: TableChoice;
  readonly detected: readonly TableRole[];
  readonly disabled: boolean;
  readonly onChange: (role: TableRole, name: string) => void;
}

/** One list per role; the loads and bearings tables are optional. */
export function TablePicker(props: TablePickerProps): React.JSX.Element {
  const styles = useStyles();
  return (
    <div className={styles.stack}>
      {ROLES.map((role) => {
        const found = props.detected.includes(role) && (props.choice[role] ?? "") !== "";
        const optional = OPTIONAL_ROLES.has(role);
        return (
          <Field
            key={role}
            label={ROLE_TITLES[role] + (optional ? " (optional)" : "")}
            hint={found ? "Found by its column headers." : undefined}
            validationState={!optional && (props.choice[role] ?? "") === "" ? "warning" : "none"}
            validationMessage={!optional && (props.choice[role] ?? "") === "" ? "No table with the expected headers; pick one." : undefined}
          >
            <Select
              data-role={role}
              value={props.choice[role] ?? ""}
              disabled={props.disabled}
              onChange={(_, data) => props.onChange(role, data.value)}
            >
              <option value="">{optional ? "None" : "Pick a table"}</option>
              {props.tables.map((t) => (
                <option key={t.name} value={t.name}>
                  {tableLabel(t)}
                </option>
              ))}
            </Select>
          </Field>
        );
      })}
    </div>
  );
}

/** Props of {@link ColumnMatcher}. */
export interface ColumnMatcherProps {
  readonly choice: TableChoice;
  /** The column step of each chosen table (undefined while it is read). */
  readonly reports: Readonly<Partial<Record<TableRole, TableReport>>>;
  readonly mapping: ColumnMapping;
  /** Header rows given (1-based sheet rows); a table left out has its header row found. */
  readonly headerRows: HeaderRows | undefined;
  readonly units: UnitSystem;
  readonly disabled: boolean;
  readonly onChange: (mapping: ColumnMapping) => void;
  readonly onHeaderRow: (role: TableRole, row: number | undefined) => void;
}

function cellLabel(c: HeaderCell): string {
  return `${c.address}: ${c.text}${c.group !== "" ? ` (under ${c.group})` : ""}`;
}

/**
 * For each chosen table, each expected column with its units and the header cell it is taken
 * from (address included); ambiguous and missing columns first. An ambiguous column lists its
 * candidate cells and takes none until the user picks one.
 */
export function ColumnMatcher(props: ColumnMatcherProps): React.JSX.Element {
  const styles = useStyles();
  const chosen = ROLES.filter((r) => (props.choice[r] ?? "") !== "");
  const openByDefault = chosen.filter((role) => {
    const r = props.reports[role];
    return r !== undefined && blockingColumns(r).length > 0;
  });
  const set = (role: TableRole, header: string, ref: string): void => {
    const current = { ...(props.mapping[role] ?? {}) };
    if (ref === "") delete current[header];
    else current[header] = ref;
    props.onChange({ ...props.mapping, [role]: current });
  };
  if (chosen.length === 0) return <Text className={styles.note}>Pick the tables first.</Text>;
  return (
    // Keyed by the chosen tables: a newly chosen table opens with its unmatched columns showing.
    <Accordion key={chosen.map((r) => props.choice[r]).join("|")} multiple collapsible defaultOpenItems={openByDefault}>
      {chosen.map((role) => {
        const report = props.reports[role];
        if (!report) return null;
        const blocking = blockingColumns(report);
        const ambiguous = report.columns.filter((c) => c.state === "ambiguous").length;
        return (
          <AccordionItem key={role} value={role}>
            <AccordionHeader>
              {ROLE_TITLES[role]}: {blocking.length === 0 ? "all needed columns found" : `${blocking.length} column${blocking.length > 1 ? "s" : ""} to match${ambiguous > 0 ? ` (${ambiguous} ambiguous)` : ""}`}
            </AccordionHeader>
            <AccordionPanel>
              <div className={styles.columns}>
                <Field
                  label="Header row (sheet row)"
                  hint={props.headerRows?.[role] === undefined ? `Found: row ${report.headerRow}. Type a row when your headers sit elsewhere (below a title block).` : `Given: row ${report.headerRow}. Clear it to have the row found.`}
                >
                  <Input
                    type="number"
                    min={1}
                    data-header-row={role}
                    value={props.headerRows?.[role] === undefined ? "" : String(props.headerRows[role])}
                    placeholder={String(report.headerRow)}
                    disabled={props.disabled}
                    onChange={(_, data) => {
                      const n = Number(data.value);
                      props.onHeaderRow(role, data.value.trim() === "" || !Number.isSafeInteger(n) || n < 1 ? undefined : n);
                    }}
                  />
                </Field>
                {report.columns.map((col) => {
                  const unit = col.units ? ` (${col.units[props.units]})` : "";
                  const taken = col.state === "found" ? col.cells[0] : undefined;
                  const hint = taken ? `Taken from ${cellLabel(taken)}. ${col.hint}` : col.hint;
                  const bad = col.state === "ambiguous" || col.state === "missing";
                  // Candidates first for an ambiguous column, then every other header cell.
                  const first = col.state === "ambiguous" ? col.cells.map((c) => c.col) : [];
                  const options = [...report.options.filter((o) => first.includes(o.col)), ...report.options.filter((o) => !first.includes(o.col))];
                  return (
                    <Field
                      key={col.header}
                      label={`${col.header}${unit}${col.required ? "" : " – optional"}`}
                      hint={hint}
                      validationState={bad ? "error" : "none"}
                      validationMessage={bad ? col.note : undefined}
                    >
                      <Select
                        data-column={`${role}:${col.header}`}
                        data-state={col.state}
                        value={taken?.ref ?? ""}
                        disabled={props.disabled}
                        onChange={(_, data) => set(role, col.header, data.value)}
                      >
                        <option value="">{col.state === "ambiguous" ? "Several fit: pick one" : "Not in this table"}</option>
                        {options.map((o) => (
                          <option key={o.col} value={o.ref}>
                            {cellLabel(o)}
                          </option>
                        ))}
                      </Select>
                    </Field>
                  );
                })}
              </div>
            </AccordionPanel>
          </AccordionItem>
        );
      })}
    </Accordion>
  );
}

/** Props of {@link UnitsPicker}. */
export interface UnitsPickerProps {
  readonly units: UnitSystem;
  readonly disabled: boolean;
  readonly onChange: (units: UnitSystem) => void;
}

/** US or SI units for the takedown sheet. */
export function UnitsPicker(props: UnitsPickerProps): React.JSX.Element {
  return (
    <Field label="Units of the takedown">
      <RadioGroup value={props.units} disabled={props.disabled} onChange={(_, data) => props.onChange(data.value === "SI" ? "SI" : "US")}>
        <Radio value="US" label="US: ft, psf, plf, kip" />
        <Radio value="SI" label="SI: m, kPa, kN/m, kN" />
      </RadioGroup>
    </Field>
  );
}
