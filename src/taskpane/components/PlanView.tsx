/**
 * The plan section: the framing plan of the level picked (a workbook with a Framing table), or
 * the schematic key plan of the typed member tables after a build, drawn at the pane's width
 * and zoomed by redrawing wider (labels stay readable; the box scrolls). Clicking a member on
 * the plan selects its row in the workbook (Framing or Members table); selecting a row, on the
 * sheet or in the member list here, highlights that member and its load path on the plan. The
 * SVG shown is the renderers' output only (they escape every text they draw), with its size fixed
 * by sizedSvg; no cell text is ever inserted as markup.
 */
import * as React from "react";
import { Button, Field, Select, Text, makeStyles, tokens } from "@fluentui/react-components";
import { sizedSvg } from "../picture";
import { ALL_LEVELS, cellOfMark, framingPlanOf, hasFramingPlan, keyPlanOf, levelOfMark, markOfRow, planSvg, type PanePlan } from "../plan-source";
import { memberAt, selectionIndexOf } from "../selection-map";
import type { PaneSession } from "../session";
import { errorText, useSelectionWatch } from "./use-selection-watch";
import type { CellSelection, TableInfo } from "../../workbook/port";
import type { BuiltTakedown, UnitSystem } from "../../workbook/takedown-api";

const useStyles = makeStyles({
  stack: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalS, minWidth: 0 },
  field: { minWidth: 0 },
  select: { minWidth: 0, maxWidth: "100%", "& select": { minWidth: 0, textOverflow: "ellipsis" } },
  row: { display: "flex", flexWrap: "wrap", columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalS, alignItems: "center" },
  note: { color: tokens.colorNeutralForeground3 },
  scroller: { width: "100%", maxHeight: "520px", overflow: "auto", border: `1px solid ${tokens.colorNeutralStroke2}`, borderRadius: tokens.borderRadiusMedium, boxSizing: "border-box" },
  figure: { margin: 0, lineHeight: 0, cursor: "pointer", "& [data-plan-mark]": { cursor: "pointer" } },
});

/** Zoom steps (drawing width as a multiple of the pane's width). */
export const ZOOMS = [1, 1.5, 2, 3, 4] as const;
/** Least drawing width in units (= CSS pixels at zoom 1). */
const MIN_WIDTH = 260;

/** Props of {@link PlanView}. */
export interface PlanViewProps {
  readonly session: PaneSession;
  /** The workbook's tables (from the scan): a Framing table makes it a framing plan. */
  readonly tables: readonly TableInfo[];
  readonly units: UnitSystem;
  /** The written takedown, when there is one (the key plan and the takedown sheet's rows). */
  readonly built?: BuiltTakedown;
}

/** The plan section. */
export function PlanView({ session, tables, units, built }: PlanViewProps): React.JSX.Element | null {
  const styles = useStyles();
  const framing = React.useMemo(() => hasFramingPlan(tables), [tables]);
  const [plan, setPlan] = React.useState<PanePlan | null>(null);
  const [level, setLevel] = React.useState<string>(ALL_LEVELS);
  const [zoom, setZoom] = React.useState(0);
  const [selected, setSelected] = React.useState<string>("");
  const [status, setStatus] = React.useState<string>("");
  const [error, setError] = React.useState<string | null>(null);
  const [paneWidth, setPaneWidth] = React.useState(300);
  const box = React.useRef<HTMLDivElement>(null);
  const follows = React.useMemo(() => session.followsSelection(), [session]);
  const index = React.useMemo(() => (built ? selectionIndexOf(built) : null), [built]);

  React.useEffect(() => {
    let current = true;
    setError(null);
    if (framing) {
      framingPlanOf(session.port, tables, units)
        .then((p) => {
          if (!current || !p) return;
          setPlan(p);
          setLevel((l) => (p.levels.includes(l) ? l : p.levels[p.levels.length - 1] ?? ALL_LEVELS));
        })
        .catch((e: unknown) => current && setError(`Could not read the framing plan: ${errorText(e)}`));
    } else if (built) {
      const p = keyPlanOf(built);
      setPlan(p);
      setLevel((l) => (p.levels.includes(l) ? l : ALL_LEVELS));
    } else setPlan(null);
    return () => {
      current = false;
    };
  }, [session, tables, units, built, framing]);

  React.useLayoutEffect(() => {
    const measure = (): void => {
      const w = box.current?.clientWidth;
      if (w !== undefined && w > 0) setPaneWidth(w);
    };
    measure();
    window.addEventListener("resize", measure);
    return () => window.removeEventListener("resize", measure);
  }, [plan]);

  const choose = React.useCallback(
    (mark: string, why: string) => {
      if (!plan) return;
      setSelected(mark);
      const on = levelOfMark(plan, mark);
      if (on !== undefined) setLevel((l) => (plan.kind === "key" && l === ALL_LEVELS ? l : on));
      setStatus(why);
    },
    [plan],
  );

  const onSelection = React.useCallback(
    (sel: CellSelection) => {
      if (!plan) return;
      const mark = markOfRow(plan, sel) ?? (index ? memberAt(index, sel)?.mark ?? null : null);
      if (mark !== null && plan.cells.has(mark)) choose(mark, `${sel.sheet}!${sel.address} is in the row of ${mark}: highlighted on the plan.`);
    },
    [plan, index, choose],
  );
  useSelectionWatch(session, follows && Boolean(plan), onSelection, setError);

  const width = Math.round(Math.max(MIN_WIDTH, paneWidth - 2) * ZOOMS[zoom]!);
  const drawn = React.useMemo(() => {
    if (!plan) return null;
    try {
      // At pane width the drawing scales to the pane (a key plan wider than asked shrinks to
      // fit); zoomed, one drawing unit is one pixel and the box scrolls.
      const svg = planSvg(plan, level, width, selected || undefined);
      return { svg: zoom === 0 ? svg : sizedSvg(svg, 1).markup, error: null };
    } catch (e) {
      return { svg: null, error: `Could not draw the plan: ${errorText(e)}` };
    }
  }, [plan, level, width, selected, zoom]);

  const selectRow = async (mark: string): Promise<void> => {
    if (!plan) return;
    const cell = cellOfMark(plan, mark);
    choose(mark, cell ? `${mark} selected on the plan: its row is ${cell.sheet}!${cell.address}.` : `${mark} has no row in the tables.`);
    if (!cell) return;
    try {
      await session.port.select(cell.sheet, cell.address);
    } catch (e) {
      setError(`Could not select ${cell.sheet}!${cell.address}: ${errorText(e)}`);
    }
  };

  const onClick = (e: React.MouseEvent<HTMLElement>): void => {
    const hit = e.target instanceof Element ? e.target.closest("[data-plan-mark]") : null;
    const mark = hit?.getAttribute("data-plan-mark");
    if (mark && plan?.cells.has(mark)) void selectRow(mark);
  };

  if (!plan) {
    return (
      <Text size={200} data-testid="plan-none">
        {framing ? "Reading the framing plan…" : "The key plan of the member tables shows here after a build. A workbook with a Framing table shows its framing plan here."}
      </Text>
    );
  }
  const marks = [...plan.cells.keys()].filter((m) => level === ALL_LEVELS || levelOfMark(plan, m) === level);
  return (
    <div className={styles.stack} data-testid="plan">
      <Text size={200}>
        {plan.kind === "framing"
          ? "The framing plan of a level: click a member to select its row of the Framing table; select a row to see it here with its tributary area and load path."
          : "The key plan of the member tables (schematic, not to scale): click a member to select its row of the Members table; select a row to see it here with its load path."}
      </Text>
      <div className={styles.row}>
        <Field label="Level" className={styles.field}>
          <Select className={styles.select} value={level} onChange={(_, d) => setLevel(d.value)} data-testid="plan-level">
            {plan.kind === "key" ? <option value={ALL_LEVELS}>Every level</option> : null}
            {plan.levels.map((l) => (
              <option key={l} value={l}>
                {l}
              </option>
            ))}
          </Select>
        </Field>
        <Field label="Member" className={styles.field}>
          <Select className={styles.select} value={marks.includes(selected) ? selected : ""} onChange={(_, d) => d.value !== "" && void selectRow(d.value)} data-testid="plan-member">
            <option value="">Pick one</option>
            {marks.map((m) => (
              <option key={m} value={m}>
                {m}
              </option>
            ))}
          </Select>
        </Field>
      </div>
      <div className={styles.row} role="group" aria-label="Zoom">
        <Button size="small" disabled={zoom === 0} onClick={() => setZoom((z) => Math.max(0, z - 1))} data-testid="plan-zoom-out" aria-label="Zoom out">
          −
        </Button>
        <Text size={200} data-testid="plan-zoom" data-zoom={ZOOMS[zoom]}>
          {Math.round(ZOOMS[zoom]! * 100)} %
        </Text>
        <Button size="small" disabled={zoom === ZOOMS.length - 1} onClick={() => setZoom((z) => Math.min(ZOOMS.length - 1, z + 1))} data-testid="plan-zoom-in" aria-label="Zoom in">
          +
        </Button>
        <Button size="small" disabled={zoom === 0} onClick={() => setZoom(0)} data-testid="plan-zoom-fit">
          Pane width
        </Button>
      </div>
      <div aria-live="polite">
        {status ? (
          <Text size={200} className={styles.note} data-testid="plan-status">
            {status}
          </Text>
        ) : null}
      </div>
      {error || drawn?.error ? (
        <Text size={200} role="alert" data-testid="plan-error">
          {error ?? drawn?.error}
        </Text>
      ) : null}
      {plan.problems.length > 0 ? (
        <Text size={200} role="note" data-testid="plan-problems">
          {`${plan.problems.length} problem${plan.problems.length > 1 ? "s" : ""} in the plan tables; the first: ${plan.problems[0]}`}
        </Text>
      ) : null}
      <div ref={box} className={styles.scroller} data-testid="plan-scroller">
        {drawn?.svg ? (
          // Renderer output only: every text in it is escaped by the renderer.
          <figure className={styles.figure} data-testid="plan-figure" data-kind={plan.kind} data-level={level} data-selected={selected} onClick={onClick} dangerouslySetInnerHTML={{ __html: drawn.svg }} />
        ) : null}
      </div>
    </div>
  );
}
