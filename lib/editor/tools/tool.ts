/**
 * The contract between the editor and its tools. A tool is a small state machine: each of its
 * states is a variant of `ToolState` with a handler object in its own file, and a handler moves
 * the machine on by calling `host.setTool` with the next state.
 */
import type { ScreenPoint, StitchPoint } from '@/lib/knit/panel';
import type { BodyMapDocument, Camera, EditorState, KeyInput, PointerInput, Selection, ToolId, ToolState } from '../types';

/** What a tool may do to the editor. Every call is applied at once; the view hears once per event. */
export interface ToolHost {
  /** The state as it is now (reflects earlier calls in the same event). */
  readonly state: EditorState;
  setTool(tool: ToolState): void;
  setSelection(selection: Selection): void;
  setCamera(camera: Camera): void;
  /** Open a stopping point in the history: changes until `endGesture` are one entry. */
  beginGesture(label: string): void;
  endGesture(): void;
  /** Drop the gesture's changes and go back to the document as it was at `beginGesture`. */
  cancelGesture(): void;
  /** Apply a document edit (refused when read-only); true when the document changed. */
  change(label: string, edit: (doc: BodyMapDocument) => BodyMapDocument): boolean;
  /** Add a zone with the draw defaults, select it; its id, or null if refused. */
  addZone(panelId: string, polygon: readonly StitchPoint[]): string | null;
  notice(message: string | null): void;
}

/** The handlers of one tool state. Handlers not given ignore the event. */
export interface StateHandlers<S extends ToolState> {
  pointerDown?(host: ToolHost, s: S, e: PointerInput): void;
  pointerMove?(host: ToolHost, s: S, e: PointerInput): void;
  pointerUp?(host: ToolHost, s: S, e: PointerInput): void;
  /** True when the key was used (the editor then skips the shortcuts). */
  keyDown?(host: ToolHost, s: S, e: KeyInput): boolean;
  /** Leave this state half-way (tool switch, undo): put back anything unfinished. */
  cancel?(host: ToolHost, s: S): void;
}

/** A `ToolState` variant by tool and state name. */
export type ToolStateOf<T extends ToolId, N extends ToolState['state']> = Extract<ToolState, { tool: T; state: N }>;

/** Pointer travel, in screen pixels, before a press becomes a drag. */
export const dragThresholdPx = 3;

/** Whether the pointer has travelled far enough from `from` to count as a drag. */
export function pastDragThreshold(from: ScreenPoint, to: ScreenPoint): boolean {
  return Math.hypot(to.x - from.x, to.y - from.y) > dragThresholdPx;
}

/** A selection of these zones with no vertex picked. */
export function zoneSelection(zoneIds: readonly string[]): Selection {
  return { zoneIds, vertex: null, outlineVertex: null };
}
