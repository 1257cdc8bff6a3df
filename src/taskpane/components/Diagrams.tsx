/**
 * Member diagrams after a build: the free-body, shear and moment diagrams and the load path of
 * the member whose row is selected in the Members table or on the takedown sheet (following the
 * selection as it moves, where the host reports it), or of the member picked in the list; either
 * one load case unfactored (with the load path under that case), or the factored case that governs
 * a quantity the user picks (M+, M-, |V|, a reaction's max or min): its combination and live load
 * pattern, drawn with the factored loads and captioned with the combination, pattern and units.
 * One figure never mixes factored and unfactored values: the load path (unfactored, by case) is
 * shown with a case only. The SVG shown is the renderers' output only (they escape every text
 * they draw); no cell text is ever inserted as markup.
 */
import * as React from "react";
import { Button, Field, Select, Text, makeStyles, tokens } from "@fluentui/react-components";
import { renderLoadPath, renderMemberSheet } from "../../drawings";
import { loadPathOf, upstreamMarks } from "../load-path-of";
import { caseChoicesOf, governingDrawingOf, memberDrawingOf, pickKey, pickOf, type DiagramPick } from "../member-drawing";
import { quantitiesOf, quantityName } from "../../engine/takedown/member-envelope";
import { base64Of, copyDrawing, pngOf, stackSvgs } from "../picture";
import { memberAt, selectionIndexOf } from "../selection-map";
import type { PaneSession } from "../session";
import { errorText, useSelectionWatch } from "./use-selection-watch";
import { TakedownCells } from "../takedown-cells";
import type { CellSelection } from "../../workbook/port";
import type { BuiltTakedown, TakedownJson } from "../../workbook/takedown-api";

const useStyles = makeStyles({
  stack: { display: "flex", flexDirection: "column", rowGap: tokens.spacingVerticalS, minWidth: 0 },
  // Long option texts must not widen the pane past 320 px.
  field: { minWidth: 0 },
  select: { minWidth: 0, maxWidth: "100%", "& select": { minWidth: 0, textOverflow: "ellipsis" } },
  row: { display: "flex", flexWrap: "wrap", columnGap: tokens.spacingHorizontalS, rowGap: tokens.spacingVerticalS, alignItems: "center" },
  note: { color: tokens.colorNeutralForeground3 },
  figure: { margin: 0, width: "100%", lineHeight: 0, border: `1px solid ${tokens.colorNeutralStroke2}`, borderRadius: tokens.borderRadiusMedium, overflow: "hidden" },
});

/** Members upstream whose loads are read for the load path (the drawing shows at most 40 rows a side). */
const UPSTREAM_LIMIT = 60;
/** The selector's first entry: the case that governs M+. */
const DEFAULT_PICK: DiagramPick = { kind: "governing", quantity: { kind: "momentMax" } };
/** Pixels per drawing unit of an inserted picture, and its width on the sheet in points. */
const PICTURE_SCALE = 2;
const PICTURE_WIDTH_PT = 360;

/** Props of {@link DiagramsView}. */
export interface DiagramsViewProps {
  readonly session: PaneSession;
  readonly built: BuiltTakedown;
  readonly json: TakedownJson;
}

interface Shown {
  readonly mark: string;
  readonly label: string;
  /** Renderer output (escaped SVG), or null for a member that does not bend. */
  readonly memberSvg: string | null;
  /** Load path under the case shown (null for a factored case: its values are not those of one case). */
  readonly pathSvg: string | null;
  /** What the figure shows, in words: the case, or the governing value with its combination, pattern and units. */
  readonly caption: string;
  /** Marks of what holds the member up, in order along it (for the reaction entries of the picker). */
  readonly supports: readonly string[];
}

/** The members in takedown order, for the picker. */
function membersOf(built: BuiltTakedown): { mark: string; text: string }[] {
  return built.plan.places.map((p) => {
    const m = built.model.members[p.member]!;
    return { mark: m.mark, text: `${m.mark} (${m.type}${m.level ? `, level ${m.level}` : ""})` };
  });
}

/** Diagrams of the selected member. */
export function DiagramsView({ session, built, json }: DiagramsViewProps): React.JSX.Element {
  const styles = useStyles();
  const cells = React.useMemo(() => new TakedownCells(session.port, built), [session, built]);
  const index = React.useMemo(() => selectionIndexOf(built), [built]);
  const members = React.useMemo(() => membersOf(built), [built]);
  const cases = React.useMemo(() => caseChoicesOf(built.model.cases), [built]);
  const [mark, setMark] = React.useState<string>("");
  const [choiceKey, setChoiceKey] = React.useState<string>(pickKey(DEFAULT_PICK));
  const [shown, setShown] = React.useState<Shown | null>(null);
  const [status, setStatus] = React.useState<string>("");
  const [error, setError] = React.useState<string | null>(null);
  const [busy, setBusy] = React.useState(false);
  const follows = React.useMemo(() => session.followsSelection(), [session]);
  const canInsert = React.useMemo(() => session.canInsertPicture(), [session]);
  const request = React.useRef(0);

  const onSelection = React.useCallback(
    (sel: CellSelection) => {
      const found = memberAt(index, sel);
      if (found) {
        setMark(found.mark);
        setStatus(`${sel.sheet}!${sel.address} is in the row${found.where === "takedown" ? "s" : ""} of ${found.mark} (${found.where === "takedown" ? "takedown sheet" : "Members table"}).`);
      } else {
        setStatus(`${sel.sheet}!${sel.address} is not in a member's row: the diagrams stay on ${mark || "no member"}.`);
      }
    },
    [index, mark],
  );
  useSelectionWatch(session, follows, onSelection, setError);

  React.useEffect(() => {
    if (mark === "") return;
    const id = ++request.current;
    setError(null);
    void (async () => {
      try {
        await cells.ensure([mark, ...upstreamMarks(built.model, cells.path, mark, UPSTREAM_LIMIT)]);
        if (id !== request.current) return;
        const loads = cells.loadsOf(mark);
        if (!loads) throw new Error(`${mark} is not in the takedown.`);
        const asked = pickOf(choiceKey, built.model.cases) ?? DEFAULT_PICK;
        // A reaction of a support this member does not have (picked on another member) falls back to M+.
        const pick = asked.kind === "governing" && "support" in asked.quantity && asked.quantity.support >= loads.supports.length ? DEFAULT_PICK : asked;
        const source = { model: built.model, deliveries: cells.path, json, loadsOf: (m: string) => cells.loadsOf(m) };
        const supports = loads.supports.map((x) => x.mark);
        if (pick.kind === "governing") {
          const g = governingDrawingOf(loads, pick.quantity, json.units);
          if (typeof g === "string") throw new Error(g);
          if (g !== null) {
            setShown({ mark, label: g.drawing.caseLabel, memberSvg: renderMemberSheet(g.drawing), pathSvg: null, caption: g.caption, supports });
            return;
          }
        }
        // A case unfactored; a member that does not bend shows its load path under the first case when a governing value was asked.
        const choice = pick.kind === "case" ? cases.find((c) => c.key === pick.loadCase) ?? cases[0]! : cases[0]!;
        const drawing = memberDrawingOf(loads, choice, json.units);
        const caption =
          pick.kind === "case"
            ? `Case ${choice.label}, unfactored (live load not reduced).`
            : `${mark} carries axial load only: governing values are given for beams, girders and joists. Case ${choice.label} shown, unfactored.`;
        setShown({
          mark,
          label: choice.label,
          memberSvg: drawing ? renderMemberSheet(drawing) : null,
          pathSvg: renderLoadPath(loadPathOf(source, loads, choice)),
          caption,
          supports,
        });
      } catch (e) {
        if (id === request.current) setError(`Could not draw ${mark}: ${errorText(e)}`);
      }
    })();
  }, [mark, choiceKey, cells, built, json, cases]);

  const showSelected = async (): Promise<void> => {
    try {
      const sel = await session.activeCell();
      if (sel) onSelection(sel);
      else setStatus("No cell is selected.");
    } catch (e) {
      setError(`Could not read the selection: ${errorText(e)}`);
    }
  };

  const picture = (): string | null => {
    const svgs = shown ? [...(shown.memberSvg ? [shown.memberSvg] : []), ...(shown.pathSvg ? [shown.pathSvg] : [])] : [];
    return svgs.length > 0 ? stackSvgs(svgs) : null;
  };

  const copy = async (): Promise<void> => {
    const svg = picture();
    if (!svg) return;
    setBusy(true);
    try {
      const how = await copyDrawing(svg);
      setStatus(how === "picture" ? `Diagrams of ${shown!.mark} copied as a picture.` : `Diagrams of ${shown!.mark} copied as SVG text (this host does not take pictures from the pane).`);
    } catch (e) {
      setError(`Could not copy: ${errorText(e)}`);
    } finally {
      setBusy(false);
    }
  };

  const insert = async (): Promise<void> => {
    const svg = picture();
    const rows = shown ? built.rowsByMember[shown.mark] : undefined;
    if (!svg || !rows || !shown) return;
    setBusy(true);
    try {
      const png = await pngOf(svg, PICTURE_SCALE);
      await session.insertPicture({
        pngBase64: await base64Of(png.blob),
        name: `Loadpath ${shown.mark}`,
        row: rows.row,
        col: built.plan.layout.width + 1,
        widthPt: PICTURE_WIDTH_PT,
        heightPt: (PICTURE_WIDTH_PT * png.height) / png.width,
      });
      setStatus(`Picture of ${shown.mark} placed on the sheet “${session.sheetName}”, right of its rows.`);
    } catch (e) {
      setError(`Could not insert the picture: ${errorText(e)}`);
    } finally {
      setBusy(false);
    }
  };

  // Reaction entries for the member shown (two supports until one is drawn).
  const supportMarks = shown?.supports ?? [];
  const quantities = quantitiesOf(Math.max(2, supportMarks.length));
  return (
    <div className={styles.stack} data-testid="diagrams">
      <Text size={200}>
        {follows
          ? `Select a cell in a member’s row of the Members table or of the sheet “${session.sheetName}”: its diagrams show here and follow the selection.`
          : `Select a cell in a member’s row of the Members table or of the sheet “${session.sheetName}”, then show it here.`}
      </Text>
      {!follows ? (
        <Button appearance="secondary" size="small" onClick={() => void showSelected()} style={{ alignSelf: "flex-start" }} data-testid="show-selected">
          Show selected member
        </Button>
      ) : null}
      <Field label="Member" className={styles.field}>
        <Select className={styles.select} value={mark} onChange={(_, d) => setMark(d.value)} data-testid="member-picker">
          <option value="">Pick a member</option>
          {members.map((m) => (
            <option key={m.mark} value={m.mark}>
              {m.text}
            </option>
          ))}
        </Select>
      </Field>
      <Field
        className={styles.field}
        label="Show"
        hint="Governing: the factored case (ASCE/SEI 7-22 Sec. 2.3.1, LRFD; L and Lr span by span, Sec. 4.3.3; L reduced by the member’s LLR factor) that gives the quantity. Unfactored: one load case as computed."
      >
        <Select className={styles.select} value={choiceKey} onChange={(_, d) => setChoiceKey(d.value)} data-testid="case-picker">
          <optgroup label="Governing case (factored)">
            {quantities.map((q) => {
              const key = pickKey({ kind: "governing", quantity: q });
              return (
                <option key={key} value={key}>
                  {"support" in q && supportMarks[q.support] ? `${quantityName(q)} (on ${supportMarks[q.support]})` : quantityName(q)}
                </option>
              );
            })}
          </optgroup>
          <optgroup label="Unfactored by case">
            {cases.map((c) => (
              <option key={c.key} value={c.key}>
                {c.label}
              </option>
            ))}
          </optgroup>
        </Select>
      </Field>
      <div aria-live="polite">
        {status ? (
          <Text size={200} className={styles.note} data-testid="diagram-status">
            {status}
          </Text>
        ) : null}
      </div>
      {error ? (
        <Text size={200} role="alert" data-testid="diagram-error">
          {error}
        </Text>
      ) : null}
      {shown ? (
        <>
          <div className={styles.row}>
            <Button size="small" disabled={busy} onClick={() => void copy()} data-testid="copy-picture">
              Copy picture
            </Button>
            {canInsert ? (
              <Button size="small" disabled={busy} onClick={() => void insert()} data-testid="insert-picture">
                Insert into “{session.sheetName}”
              </Button>
            ) : null}
          </div>
          <Text size={200} data-testid="diagram-caption" data-mark={shown.mark}>
            {shown.caption}
          </Text>
          {shown.memberSvg ? (
            // Renderer output only: every text in it is escaped by the renderer.
            <figure className={styles.figure} data-testid="member-sheet" data-mark={shown.mark} data-case={shown.label} dangerouslySetInnerHTML={{ __html: shown.memberSvg }} />
          ) : (
            <Text size={200} data-testid="no-bending">
              {shown.mark} carries axial load only: no shear or moment diagram. Its load path is below.
            </Text>
          )}
          {shown.pathSvg ? (
            <figure className={styles.figure} data-testid="load-path" data-mark={shown.mark} dangerouslySetInnerHTML={{ __html: shown.pathSvg }} />
          ) : (
            <Text size={200} className={styles.note} data-testid="no-load-path">
              The load path is drawn per load case, unfactored: pick a case under “Unfactored by case”.
            </Text>
          )}
        </>
      ) : null}
    </div>
  );
}
