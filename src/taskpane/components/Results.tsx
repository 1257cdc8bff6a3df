/** What a build found: the problems (each selects its cell) and the summary of a finished takedown. */
import * as React from "react";
import { Button, Text, makeStyles, tokens } from "@fluentui/react-components";
import type { Problem, TakedownSummary, UnitSystem } from "../../workbook/takedown-api";

const useStyles = makeStyles({
  list: { listStyleType: "none", margin: 0, padding: 0, display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalXS },
  problem: {
    width: "100%",
    justifyContent: "flex-start",
    textAlign: "left",
    height: "auto",
    paddingTop: tokens.spacingVerticalS,
    paddingBottom: tokens.spacingVerticalS,
    fontWeight: tokens.fontWeightRegular,
  },
  problemBody: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalXXS, minWidth: 0 },
  cell: { fontFamily: tokens.fontFamilyMonospace, color: tokens.colorNeutralForeground3, fontSize: tokens.fontSizeBase200 },
  message: { overflowWrap: "anywhere" },
  table: { width: "100%", borderCollapse: "collapse", fontSize: tokens.fontSizeBase300 },
  th: { textAlign: "left", fontWeight: tokens.fontWeightSemibold, borderBottom: `1px solid ${tokens.colorNeutralStroke1}`, padding: "2px 4px" },
  td: { padding: "2px 4px", borderBottom: `1px solid ${tokens.colorNeutralStroke2}` },
  num: { textAlign: "right", fontVariantNumeric: "tabular-nums", padding: "2px 4px", borderBottom: `1px solid ${tokens.colorNeutralStroke2}` },
  section: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalS },
});

/** Props of {@link ProblemList}. */
export interface ProblemListProps {
  readonly problems: readonly Problem[];
  readonly onShow: (problem: Problem) => void;
}

/** Every problem with its message and cell; activating one selects that cell in the workbook. */
export function ProblemList(props: ProblemListProps): React.JSX.Element {
  const styles = useStyles();
  return (
    <ul className={styles.list} aria-label="Problems">
      {props.problems.map((p, i) => (
        <li key={`${p.code}-${p.sheet}-${p.cell}-${i}`}>
          <Button
            appearance="subtle"
            className={styles.problem}
            data-problem={p.code}
            data-cell={`${p.sheet}!${p.cell}`}
            onClick={() => props.onShow(p)}
            aria-label={`${p.message} Go to ${p.sheet} ${p.cell}.`}
          >
            <span className={styles.problemBody}>
              <span className={styles.message}>{p.message}</span>
              <span className={styles.cell}>
                {p.sheet}!{p.cell}
              </span>
            </span>
          </Button>
        </li>
      ))}
    </ul>
  );
}

/** Force unit of the totals. */
export function forceUnit(units: UnitSystem): string {
  return units === "SI" ? "kN" : "kip";
}

/** A total with sensible digits for a summary line. */
export function formatTotal(value: number): string {
  if (!Number.isFinite(value)) return "—";
  const digits = Math.abs(value) >= 1000 ? 0 : Math.abs(value) >= 10 ? 1 : 2;
  // A round-off difference such as -5.7e-14 reads 0.00, not -0.00.
  const shown = Math.abs(value) < 0.5 * 10 ** -digits ? 0 : value;
  return shown.toLocaleString("en-US", { minimumFractionDigits: digits, maximumFractionDigits: digits });
}

/** Props of {@link SummaryView}. */
export interface SummaryViewProps {
  readonly summary: TakedownSummary;
  readonly units: UnitSystem;
  readonly sheet: string | undefined;
}

/** Members by type, levels, total load per case and the load balance (applied against supports). */
export function SummaryView(props: SummaryViewProps): React.JSX.Element {
  const styles = useStyles();
  const s = props.summary;
  const unit = forceUnit(props.units);
  const cases = [...new Set([...Object.keys(s.appliedByCase), ...Object.keys(s.supportsByCase)])];
  const types = Object.entries(s.membersByType).filter(([, n]) => n > 0);
  const total = types.reduce((sum, [, n]) => sum + n, 0);
  return (
    <div className={styles.section} data-testid="summary">
      {props.sheet ? <Text>Written to the sheet “{props.sheet}” as live formulas.</Text> : null}
      <table className={styles.table} aria-label="Members by type">
        <thead>
          <tr>
            <th className={styles.th} scope="col">Member type</th>
            <th className={styles.th} scope="col" style={{ textAlign: "right" }}>Count</th>
          </tr>
        </thead>
        <tbody>
          {types.map(([type, n]) => (
            <tr key={type} data-type={type}>
              <td className={styles.td}>{type}</td>
              <td className={styles.num}>{n}</td>
            </tr>
          ))}
          <tr>
            <td className={styles.td}>All members</td>
            <td className={styles.num} data-testid="member-total">{total}</td>
          </tr>
        </tbody>
      </table>
      <Text>
        Levels ({s.levels.length}): <span data-testid="levels">{s.levels.join(", ")}</span>
      </Text>
      <table className={styles.table} aria-label="Load balance">
        <caption style={{ textAlign: "left", fontWeight: 600, paddingBottom: 4 }}>Load balance ({unit})</caption>
        <thead>
          <tr>
            <th className={styles.th} scope="col">Case</th>
            <th className={styles.th} scope="col" style={{ textAlign: "right" }}>Applied</th>
            <th className={styles.th} scope="col" style={{ textAlign: "right" }}>At supports</th>
            <th className={styles.th} scope="col" style={{ textAlign: "right" }}>Difference</th>
          </tr>
        </thead>
        <tbody>
          {cases.map((c) => {
            const applied = s.appliedByCase[c] ?? 0;
            const supports = s.supportsByCase[c] ?? 0;
            return (
              <tr key={c} data-case={c}>
                <th className={styles.td} scope="row">{c}</th>
                <td className={styles.num} data-applied={applied}>{formatTotal(applied)}</td>
                <td className={styles.num} data-supports={supports}>{formatTotal(supports)}</td>
                <td className={styles.num}>{formatTotal(applied - supports)}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
