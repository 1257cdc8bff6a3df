/** Following the workbook's selection from a pane section, shared by the diagrams and the plan. */
import * as React from "react";
import type { PaneSession } from "../session";
import type { CellSelection } from "../../workbook/port";

/** An error's message for the pane. */
export function errorText(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

/**
 * Call `onSelection` on every selection change while `enabled`; the latest callback is used, so
 * it may change on every render without resubscribing. A failure to subscribe goes to `onError`.
 */
export function useSelectionWatch(session: PaneSession, enabled: boolean, onSelection: (sel: CellSelection) => void, onError: (message: string) => void): void {
  const handler = React.useRef(onSelection);
  handler.current = onSelection;
  const fail = React.useRef(onError);
  fail.current = onError;
  React.useEffect(() => {
    if (!enabled) return undefined;
    let stop: (() => void) | null = null;
    let live = true;
    session
      .watchSelection((sel) => handler.current(sel))
      .then((s) => {
        if (live) stop = s;
        else s();
      })
      .catch((e: unknown) => fail.current(`Could not follow the selection: ${errorText(e)}`));
    return () => {
      live = false;
      stop?.();
    };
  }, [session, enabled]);
}
