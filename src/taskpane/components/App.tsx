/** The pane: input tables, column matching, units, build with progress, problems and summary. */
import { findPlanTables, planChanged, runPlan, type DerivedCounts } from "../plan-session";
import type { PlanTableNames } from "../../workbook/plan-build";
import * as React from "react";
import {
  Button,
  Checkbox,
  Dialog,
  DialogActions,
  DialogBody,
  DialogContent,
  DialogSurface,
  DialogTitle,
  Divider,
  MessageBar,
  MessageBarBody,
  ProgressBar,
  Spinner,
  Text,
  makeStyles,
  tokens,
} from "@fluentui/react-components";
import type { ColumnMapping, HeaderRows, Problem, TakedownBuildResult, UnitSystem } from "../../workbook/takedown-api";
import { SETTINGS_SHEET } from "../../workbook/saved-matching";
import { blockingColumns, ROLES, ROLE_TITLES, type TableReport, type TableRole } from "../schema";
import type { PaneSession, ScanResult, TableChoice } from "../session";
import { DiagramsView } from "./Diagrams";
import { PlanView } from "./PlanView";
import { hasFramingPlan } from "../plan-source";
import { ColumnMatcher, TablePicker, UnitsPicker } from "./Inputs";
import { ProblemList, SummaryView } from "./Results";

/** The caution every surface carries (DEVELOPERS.md, Rules every change keeps). */
export const CAUTION =
  "Results are a calculation aid: a qualified engineer must review them; local codes govern (the codes adopted where the building stands).";

const useStyles = makeStyles({
  pane: { display: "flex", flexDirection: "column", minWidth: "280px", maxWidth: "640px", boxSizing: "border-box" },
  header: {
    display: "flex",
    flexDirection: "column",
    rowGap: tokens.spacingVerticalXS,
    padding: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalM}`,
    backgroundColor: tokens.colorNeutralBackground3,
    borderBottom: `1px solid ${tokens.colorNeutralStroke2}`,
  },
  title: { margin: 0, fontSize: tokens.fontSizeBase500, fontWeight: tokens.fontWeightSemibold },
  main: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalL, padding: tokens.spacingHorizontalM },
  section: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalS, minWidth: 0 },
  h2: { margin: 0, fontSize: tokens.fontSizeBase400, fontWeight: tokens.fontWeightSemibold },
  buildRow: { display: "flex", flexWrap: "wrap", columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalS, alignItems: "center" },
  caution: { padding: tokens.spacingHorizontalM, color: tokens.colorNeutralForeground2, fontSize: tokens.fontSizeBase200 },
  status: { color: tokens.colorNeutralForeground3 },
  connected: {
    alignSelf: "flex-start",
    padding: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalS}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorPaletteGreenBackground1,
    color: tokens.colorPaletteGreenForeground1,
  },
  offline: {
    alignSelf: "flex-start",
    padding: `${tokens.spacingVerticalXXS} ${tokens.spacingHorizontalS}`,
    borderRadius: tokens.borderRadiusMedium,
    backgroundColor: tokens.colorPaletteYellowBackground1,
    color: tokens.colorNeutralForeground1,
    border: `1px solid ${tokens.colorPaletteYellowBorder1}`,
  },
});

/** Props of {@link App}. */
export interface AppProps {
  readonly session: PaneSession;
  /** True inside Excel; false on the demo page (in-memory workbook). */
  readonly connected: boolean;
}

interface Progress {
  readonly fraction: number;
  readonly message: string;
}

const NO_CHOICE: TableChoice = { zones: "", members: "", loads: "", bearings: "" };

/** The task pane. */
export function App({ session, connected }: AppProps): React.JSX.Element {
  const styles = useStyles();
  const [scan, setScan] = React.useState<ScanResult | null>(null);
  const [choice, setChoice] = React.useState<TableChoice>(NO_CHOICE);
  const [mapping, setMapping] = React.useState<ColumnMapping>({});
  const [units, setUnits] = React.useState<UnitSystem>("US");
  const [native, setNative] = React.useState(false);
  const [progress, setProgress] = React.useState<Progress | null>(null);
  const [result, setResult] = React.useState<TakedownBuildResult | null>(null);
  const [resultUnits, setResultUnits] = React.useState<UnitSystem>("US");
  const [error, setError] = React.useState<string | null>(null);
  const [askReplace, setAskReplace] = React.useState<string | null>(null);
  const [selected, setSelected] = React.useState<string>("");
  const [headerRows, setHeaderRows] = React.useState<HeaderRows | undefined>(undefined);
  const [bearings, setBearings] = React.useState<string | undefined>(undefined);
  const [reports, setReports] = React.useState<Partial<Record<TableRole, TableReport>>>({});
  // A framing plan in the workbook (used when no members table is chosen), what was derived, and whether it changed since.
  const [plan, setPlan] = React.useState<PlanTableNames | null>(null);
  const [derived, setDerived] = React.useState<DerivedCounts | null>(null);
  const [planStale, setPlanStale] = React.useState(false);
  // "saved": the matching shown is the one on the settings sheet; "changed": not saved since changed.
  const [matchingState, setMatchingState] = React.useState<"none" | "saved" | "changed" | "saving">("none");
  const busy = progress !== null;

  const refresh = React.useCallback(async () => {
    setError(null);
    try {
      const saved = await session.loadSettings();
      setMapping(saved.mapping);
      setUnits(saved.units);
      setHeaderRows(saved.headerRows);
      setBearings(saved.bearings);
      setMatchingState(saved.source === "sheet" ? "saved" : "none");
      if (saved.problem !== undefined) setError(`The saved matching could not be read: ${saved.problem}`);
      const found = await session.scan(saved.tables, saved.mapping);
      setScan(found);
      setChoice(found.choice);
      const planTables = findPlanTables(found.tables);
      setPlan(planTables);
      setPlanStale(planTables !== null && (await planChanged(session.port, planTables)));
    } catch (e) {
      setError(`Could not read the workbook: ${e instanceof Error ? e.message : String(e)}`);
    }
  }, [session]);

  React.useEffect(() => {
    void refresh();
  }, [refresh]);

  React.useEffect(() => {
    // Start-up time of the pane (bench/pane.bench.ts reads this mark).
    if (scan !== null && typeof performance !== "undefined" && performance.getEntriesByName("loadpath-pane-ready").length === 0) performance.mark("loadpath-pane-ready");
  }, [scan]);

  React.useEffect(() => {
    // The column step of each chosen table, read as the build reads it.
    if (scan === null) return;
    let current = true;
    const roles = ROLES.filter((r) => (choice[r] ?? "") !== "");
    Promise.all(roles.map(async (r) => [r, await session.columnReport(r, choice[r] ?? "", mapping, headerRows?.[r])] as const))
      .then((pairs) => {
        if (current) setReports(Object.fromEntries(pairs));
      })
      .catch((e: unknown) => {
        if (current) setError(`Could not read the tables: ${e instanceof Error ? e.message : String(e)}`);
      });
    return () => {
      current = false;
    };
  }, [session, scan, choice, mapping, headerRows]);

  const saveMatching = async (): Promise<void> => {
    setError(null);
    setMatchingState("saving");
    try {
      await session.saveMatching({ tables: choice, mapping, units, ...(headerRows ? { headerRows } : {}), ...(bearings ? { bearings } : {}) });
      setMatchingState("saved");
    } catch (e) {
      setMatchingState("changed");
      setError(`Could not save the matching: ${e instanceof Error ? e.message : String(e)}`);
    }
  };

  const remember = (next: { choice?: TableChoice; mapping?: ColumnMapping; units?: UnitSystem }): void => {
    const tables = next.choice ?? choice;
    const m = next.mapping ?? mapping;
    const u = next.units ?? units;
    if (next.choice) setChoice(next.choice);
    if (next.mapping) setMapping(next.mapping);
    if (next.units) setUnits(next.units);
    setMatchingState("changed");
    session.saveSettings({ tables, mapping: m, units: u }).catch((e: unknown) => setError(`Could not save the settings: ${e instanceof Error ? e.message : String(e)}`));
  };

  const build = async (replaceForeign: boolean): Promise<void> => {
    setAskReplace(null);
    setError(null);
    setSelected("");
    setProgress({ fraction: 0, message: "Reading the tables…" });
    try {
      if (choice.members === "" && plan !== null) {
        setProgress({ fraction: 0.1, message: "Deriving the members from the framing plan…" });
        const names = { ...plan, ...(choice.loads ? { loads: choice.loads } : {}) };
        const run = await runPlan(session.port, names, { zones: choice.zones, units, sheetName: session.sheetName, native, replaceForeign });
        setResult(run.result);
        setResultUnits(units);
        setDerived(run.counts);
        setPlanStale(false);
        return;
      }
      setDerived(null);
      const outcome = await session.run(choice, { mapping, units, native, ...(headerRows ? { headerRows } : {}), ...(bearings ? { bearings } : {}) }, (fraction, message) => setProgress({ fraction, message }), replaceForeign);
      if (outcome.kind === "askReplace") setAskReplace(outcome.sheet);
      else {
        setResult(outcome.result);
        setResultUnits(units);
      }
    } catch (e) {
      setError(`The build stopped: ${e instanceof Error ? e.message : String(e)}`);
    } finally {
      setProgress(null);
    }
  };

  const show = (p: Problem): void => {
    setSelected(`${p.sheet}!${p.cell}`);
    session.show(p).catch((e: unknown) => setError(`Could not select ${p.sheet}!${p.cell}: ${e instanceof Error ? e.message : String(e)}`));
  };

  const lacking = ROLES.flatMap((role) => {
    const report = choice[role] !== "" ? reports[role] : undefined;
    return report ? blockingColumns(report).map((c) => `${ROLE_TITLES[role]}: ${c}`) : [];
  });
  const ready = choice.zones !== "" && (choice.members !== "" || plan !== null) && lacking.length === 0;
  const problems = result?.problems ?? [];

  return (
    <div className={styles.pane}>
      <header className={styles.header}>
        <h1 className={styles.title}>Loadpath takedown</h1>
        <Text size={200}>From your member tables to live takedown formulas, floor by floor.</Text>
        <Text size={200} className={connected ? styles.connected : styles.offline} data-testid="connection">
          {connected ? "Connected to Excel" : "Not connected to Excel: a sample workbook kept in this browser"}
        </Text>
      </header>
      <main className={styles.main}>
        {error ? (
          <MessageBar intent="error" role="alert">
            <MessageBarBody>{error}</MessageBarBody>
          </MessageBar>
        ) : null}
        {scan === null ? (
          <Spinner size="small" label="Looking for your tables…" />
        ) : (
          <>
            <section className={styles.section} aria-labelledby="lp-tables">
              <h2 id="lp-tables" className={styles.h2}>1. Input tables</h2>
              <TablePicker tables={scan.tables} choice={choice} detected={scan.detected} disabled={busy} onChange={(role, name) => remember({ choice: { ...choice, [role]: name } })} />
              <Button appearance="secondary" size="small" disabled={busy} onClick={() => void refresh()} style={{ alignSelf: "flex-start" }}>
                Look for tables again
              </Button>
            </section>
            <section className={styles.section} aria-labelledby="lp-columns">
              <h2 id="lp-columns" className={styles.h2}>2. Columns</h2>
              <ColumnMatcher
                choice={choice}
                reports={reports}
                mapping={mapping}
                headerRows={headerRows}
                units={units}
                disabled={busy}
                onChange={(m) => remember({ mapping: m })}
                onHeaderRow={(role, row) => {
                  const next: Record<string, number> = { ...(headerRows ?? {}) };
                  if (row === undefined) delete next[role];
                  else next[role] = row;
                  setHeaderRows(Object.keys(next).length > 0 ? next : undefined);
                  setMatchingState("changed");
                }}
              />
            </section>
            <section className={styles.section} aria-labelledby="lp-units">
              <h2 id="lp-units" className={styles.h2}>3. Units</h2>
              <UnitsPicker units={units} disabled={busy} onChange={(u) => remember({ units: u })} />
            </section>
            <section className={styles.section} aria-labelledby="lp-save">
              <h2 id="lp-save" className={styles.h2}>4. Save the matching</h2>
              <div className={styles.buildRow}>
                <Button appearance="secondary" disabled={busy || matchingState === "saving" || choice.members === ""} onClick={() => void saveMatching()} data-testid="save-matching">
                  Save the matching in the workbook
                </Button>
                <Text size={200} className={styles.status} data-testid="matching-state">
                  {matchingState === "saved" ? `Saved on the sheet “${SETTINGS_SHEET}”.` : matchingState === "changed" ? "Changed since it was saved." : matchingState === "saving" ? "Saving…" : "Not saved yet."}
                </Text>
              </div>
              <Text size={200} role="note">
                The tables, columns and units are kept on the sheet “{SETTINGS_SHEET}”, which the loadpath command reads too. Saving or changing the matching rebuilds nothing by itself: build again to update the takedown.
              </Text>
            </section>
            <section className={styles.section} aria-labelledby="lp-build">
              <h2 id="lp-build" className={styles.h2}>5. Build</h2>
              <div className={styles.buildRow}>
                <Button appearance="primary" disabled={busy || !ready} onClick={() => void build(false)} data-testid="build">
                  {result?.ok && result.sheet ? "Rebuild takedown" : "Build takedown"}
                </Button>
                <Text size={200} className={styles.status}>
                  Writes only the sheet “{session.sheetName}”.
                </Text>
              </div>
              <Checkbox
                checked={native}
                disabled={busy}
                onChange={(_, data) => setNative(data.checked === true)}
                label="Hand-off version: classic spreadsheet functions only, so the sheet recalculates without the add-in (for a checker or another office)"
                data-testid="native"
              />
              {plan !== null && choice.members === "" ? (
                <Text size={200} role="note" data-testid="plan-found">
                  Framing plan found ({[`Framing: ${plan.framing}`, plan.decks ? `Decks: ${plan.decks}` : "", plan.grids ? `Grids: ${plan.grids}` : "", plan.levels ? `Levels: ${plan.levels}` : ""].filter((x) => x !== "").join(", ")}): the members, supports and tributary loads are derived from it onto the sheets “Plan members”, “Plan loads” and “Plan bearings”.
                  {planStale ? " The plan changed since the last derivation: rebuild to update the takedown." : ""}
                </Text>
              ) : null}
              {!ready && scan ? (
                <Text size={200} role="note">
                  {lacking.length > 0 ? `Match these columns first: ${lacking.join("; ")}.` : "Pick the load zones and members tables first."}
                </Text>
              ) : null}
              <div aria-live="polite">
                {progress ? (
                  <div className={styles.section}>
                    <ProgressBar value={progress.fraction} max={1} aria-label="Build progress" />
                    <Text size={200} data-testid="progress">{progress.message}</Text>
                  </div>
                ) : null}
              </div>
            </section>
            {result ? (
              <section className={styles.section} aria-labelledby="lp-result" data-testid="result">
                <h2 id="lp-result" className={styles.h2}>
                  {problems.length === 0 ? "Takedown built" : result.ok ? `Built, with ${problems.length} problem${problems.length > 1 ? "s" : ""} to check` : `${problems.length} problem${problems.length > 1 ? "s" : ""} to fix`}
                </h2>
                {problems.length > 0 ? (
                  <>
                    {!result.ok ? <Text size={200}>Nothing was written. Select a problem to go to its cell.</Text> : null}
                    <ProblemList problems={problems} onShow={show} />
                    <div aria-live="polite">
                      {selected ? <Text size={200} data-testid="selected">Selected {selected}.</Text> : null}
                    </div>
                  </>
                ) : null}
                {derived ? (
                  <Text size={200} data-testid="derived-counts">
                    Derived from the plan: {Object.entries(derived.byType).map(([t, n]) => `${n} ${t}${n === 1 ? "" : "s"}`).join(", ")}
                    {derived.addedFoundations > 0 ? ` (${derived.addedFoundations} foundation${derived.addedFoundations === 1 ? "" : "s"} added under columns)` : ""}; {derived.pieces} deck piece{derived.pieces === 1 ? "" : "s"}; {derived.bearings} bearing{derived.bearings === 1 ? "" : "s"}.
                  </Text>
                ) : null}
                {result.summary ? <SummaryView summary={result.summary} units={resultUnits} sheet={result.sheet} /> : null}
                {result.valueOnly ? (
                  <Text size={200} role="note" data-testid="handoff">
                    {result.valueOnly.length === 0
                      ? `Hand-off version: every load, reaction, shear, moment, column load and the balance is a live formula in classic spreadsheet functions${(result.governingValuesOnly ?? 0) > 0 ? "; governing values and deflection checks are values computed by the add-in (each cell has a note)" : ""}.`
                      : `Hand-off version: written as values (not live): ${result.valueOnly.map((v) => `${v.mark} (${v.reason})`).join("; ")}.`}
                  </Text>
                ) : null}
              </section>
            ) : null}
            {result?.ok && result.built && result.json ? (
              <section className={styles.section} aria-labelledby="lp-diagrams">
                <h2 id="lp-diagrams" className={styles.h2}>6. Member diagrams</h2>
                <DiagramsView session={session} built={result.built} json={result.json} />
              </section>
            ) : null}
            {hasFramingPlan(scan.tables) || (result?.ok && result.built) ? (
              <section className={styles.section} aria-labelledby="lp-plan">
                <h2 id="lp-plan" className={styles.h2}>7. Plan</h2>
                <PlanView session={session} tables={scan.tables} units={units} {...(result?.ok && result.built ? { built: result.built } : {})} />
              </section>
            ) : null}
          </>
        )}
      </main>
      <Divider />
      <footer className={styles.caution} role="note" data-testid="caution">
        {CAUTION}
      </footer>
      <Dialog open={askReplace !== null} modalType="alert" onOpenChange={(_, data) => !data.open && setAskReplace(null)}>
        <DialogSurface>
          <DialogBody>
            <DialogTitle>Replace the sheet “{askReplace}”?</DialogTitle>
            <DialogContent>
              This workbook already has a sheet named “{askReplace}” that Loadpath did not create. Building replaces everything on it.
            </DialogContent>
            <DialogActions>
              <Button appearance="secondary" onClick={() => setAskReplace(null)}>
                Keep my sheet
              </Button>
              <Button appearance="primary" onClick={() => void build(true)}>
                Replace it
              </Button>
            </DialogActions>
          </DialogBody>
        </DialogSurface>
      </Dialog>
    </div>
  );
}
