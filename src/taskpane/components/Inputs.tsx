/** Choosing the input tables, matching their columns, and the unit system. */
import * as React from "react";
import { Accordion, AccordionHeader, AccordionItem, AccordionPanel, Field, Radio, RadioGroup, Select, Text, makeStyles, tokens } from "@fluentui/react-components";
import type { TableInfo } from "../../workbook/port";
import type { ColumnMapping, UnitSystem } from "../../workbook/takedown-api";
import { OPTIONAL_ROLES, ROLES, ROLE_COLUMNS, ROLE_TITLES, matchColumns, missingColumns, type TableRole } from "../schema";
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
  readonly tables: readonly TableInfo[];
  readonly choice: TableChoice;
  readonly mapping: ColumnMapping;
  readonly units: UnitSystem;
  readonly disabled: boolean;
  readonly onChange: (mapping: ColumnMapping) => void;
}

/** For each chosen table, each expected column with its units and the user's column that carries it. */
export function ColumnMatcher(props: ColumnMatcherProps): React.JSX.Element {
  const styles = useStyles();
  const chosen = ROLES.filter((r) => (props.choice[r] ?? "") !== "");
  const openByDefault = chosen.filter((role) => {
    const t = props.tables.find((x) => x.name === props.choice[role]);
    return t !== undefined && missingColumns(role, t.headers, props.mapping).length > 0;
  });
  const set = (role: TableRole, header: string, userHeader: string): void => {
    const current = { ...(props.mapping[role] ?? {}) };
    if (userHeader === "") delete current[header];
    else current[header] = userHeader;
    props.onChange({ ...props.mapping, [role]: current });
  };
  if (chosen.length === 0) return <Text className={styles.note}>Pick the tables first.</Text>;
  return (
    // Keyed by the chosen tables: a newly chosen table opens with its unmatched columns showing.
    <Accordion key={chosen.map((r) => props.choice[r]).join("|")} multiple collapsible defaultOpenItems={openByDefault}>
      {chosen.map((role) => {
        const table = props.tables.find((x) => x.name === props.choice[role]);
        if (!table) return null;
        const found = matchColumns(role, table.headers, props.mapping);
        const missing = missingColumns(role, table.headers, props.mapping);
        return (
          <AccordionItem key={role} value={role}>
            <AccordionHeader>
              {ROLE_TITLES[role]}: {missing.length === 0 ? "all needed columns found" : `${missing.length} needed column${missing.length > 1 ? "s" : ""} to match`}
            </AccordionHeader>
            <AccordionPanel>
              <div className={styles.columns}>
                {ROLE_COLUMNS[role].map((spec) => {
                  const unit = spec.units ? ` (${spec.units[props.units]})` : "";
                  const lacking = spec.required && found[spec.header] === null;
                  return (
                    <Field
                      key={spec.header}
                      label={`${spec.header}${unit}${spec.required ? "" : " – optional"}`}
                      hint={spec.hint}
                      validationState={lacking ? "error" : "none"}
                      validationMessage={lacking ? "Needed for a build: pick the column that holds it." : undefined}
                    >
                      <Select
                        data-column={`${role}:${spec.header}`}
                        value={found[spec.header] ?? ""}
                        disabled={props.disabled}
                        onChange={(_, data) => set(role, spec.header, data.value)}
                      >
                        <option value="">Not in this table</option>
                        {table.headers
                          .filter((h) => h !== "")
                          .map((h) => (
                            <option key={h} value={h}>
                              {h}
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
