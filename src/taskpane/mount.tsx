/** Render the pane into a page element: the Excel task pane and the demo page share this. */
import * as React from "react";
import { createRoot, type Root } from "react-dom/client";
import { FluentProvider, webLightTheme } from "@fluentui/react-components";
import type { WorkbookPort } from "../workbook/port";
import type { BuildTakedown } from "../workbook/takedown-api";
import { App } from "./components/App";
import { PaneSession } from "./session";

/** What the pane needs from its page. */
export interface MountOptions {
  readonly port: WorkbookPort;
  readonly build: BuildTakedown;
  /** True inside Excel. */
  readonly connected: boolean;
  /** Generated sheet name (default "Takedown"). */
  readonly sheetName?: string;
}

/** Mount the pane on `element`; returns the React root (to unmount in tests). */
export function mountPane(element: HTMLElement, options: MountOptions): Root {
  const session = new PaneSession(options.port, options.build, options.sheetName);
  const root = createRoot(element);
  root.render(
    <FluentProvider theme={webLightTheme}>
      <App session={session} connected={options.connected} />
    </FluentProvider>,
  );
  return root;
}

/** Show a message in place of the pane when it cannot start (never only logged). */
export function showStartupError(element: HTMLElement, message: string): void {
  element.textContent = "";
  const p = document.createElement("p");
  p.setAttribute("role", "alert");
  p.textContent = message;
  element.append(p);
}
