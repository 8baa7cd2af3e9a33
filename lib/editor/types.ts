/**
 * The body-map editor's state and inputs. Plain data only: the whole `EditorState` is one
 * immutable value that the editor replaces on every change, so a view can read it with
 * `useSyncExternalStore` and compare parts by reference.
 */
import type { Panel, ScreenPoint, StitchPoint, StitchPolygon, ZoneFunction } from '@/lib/knit/panel';

/** What the editor edits and saves: the style's panels and the style version they belong to. */
export interface BodyMapDocument {
  /** The style's version the panels were loaded at or last saved as (optimistic concurrency). */
  readonly version: number;
  readonly panels: readonly Panel[];
}

/** What the editor needs to know about a texture from the studio library. */
export interface TextureInfo {
  /** Repeat width in needles (W). */
  repeatNeedles: number;
  /** Repeat height in courses (H). */
  repeatCourses: number;
  /** Relaxed density across the fabric. */
  walesPerCm: number;
  /** Relaxed density along the fabric. */
  coursesPerCm: number;
  /**
   * The function the texture is made for, if any. A zone given the texture takes it as its tag,
   * unless the designer has tagged the zone otherwise.
   */
  fn?: ZoneFunction | null;
}

/** Texture id → what the editor needs of it. Textures missing here fall back to defaults. */
export type TextureLookup = Readonly<Record<string, TextureInfo>>;

/** A panel's stitch density, which sets how wide a needle and how tall a course is on screen. */
export interface StitchDensity {
  walesPerCm: number;
  coursesPerCm: number;
}

export interface Snapping {
  /** Vertices and moves land on whole needles and courses. On by default. */
  needleGrid: boolean;
  /** Vertices land on the repeat lattice of the zone's texture; moves go by whole repeats. */
  wholeRepeats: boolean;
}

/**
 * The view onto the panels. Stitch space is mapped through centimetres so that panels of
 * different densities keep their true relative size: a needle is `pxPerCm / walesPerCm` px wide
 * and a course `pxPerCm / coursesPerCm` px tall.
 */
export interface Camera {
  /** Screen pixels per centimetre of relaxed fabric. */
  pxPerCm: number;
  /** Where the layout's origin (the top-left corner of the first panel) sits on screen. */
  pan: ScreenPoint;
}

export interface Viewport {
  widthPx: number;
  heightPx: number;
}

export interface VertexRef {
  zoneId: string;
  index: number;
}

export interface OutlineVertexRef {
  panelId: string;
  index: number;
}

export interface Selection {
  zoneIds: readonly string[];
  /** A selected vertex of one of the selected zones (arrow keys and Delete act on it). */
  vertex: VertexRef | null;
  /** A selected point of a panel's cut outline (while cut-line editing is on). */
  outlineVertex: OutlineVertexRef | null;
}

/** The tools, in the order a toolbar shows them. */
export const toolIds = ['select', 'draw-zone', 'pan', 'zoom'] as const;
export type ToolId = (typeof toolIds)[number];

/** What lies under a screen point, as found by `hitTest`. */
export type HitTarget =
  | { kind: 'vertex'; panelId: string; zoneId: string; index: number }
  | { kind: 'edge'; panelId: string; zoneId: string; index: number; point: StitchPoint }
  | { kind: 'outline-vertex'; panelId: string; index: number }
  | { kind: 'zone'; panelId: string; zoneId: string }
  | { kind: 'panel'; panelId: string; point: StitchPoint };

/** Why the draw tool refused a point or a close. */
export type DrawProblem = 'too-few-points' | 'too-many-points' | 'self-intersecting' | 'zero-area' | 'panel-full';

/** The active tool and the state it is in. Each variant has its own file under `tools/`. */
export type ToolState =
  | { tool: 'select'; state: 'idle'; hover: HitTarget | null }
  | {
      tool: 'select';
      state: 'pointing-zone';
      panelId: string;
      zoneId: string;
      downAt: ScreenPoint;
      /** Shift-click that removed the zone from the selection: nothing to drag. */
      toggledOff: boolean;
      shift: boolean;
    }
  | {
      tool: 'select';
      state: 'translating';
      downAt: ScreenPoint;
      /** Polygons of the moving zones when the drag began. */
      start: Readonly<Record<string, StitchPolygon>>;
      /** The zone that was grabbed: its texture sets the repeat step when snapping to repeats. */
      anchorZoneId: string;
    }
  | {
      tool: 'select';
      state: 'dragging-vertex';
      zoneId: string;
      index: number;
      startPolygon: StitchPolygon;
    }
  | {
      tool: 'select';
      state: 'dragging-outline';
      panelId: string;
      index: number;
      startOutline: StitchPolygon;
    }
  | {
      tool: 'select';
      state: 'marquee';
      downAt: ScreenPoint;
      current: ScreenPoint;
      /** Shift held: add to the selection instead of replacing it. */
      additive: boolean;
      /** Passed the drag threshold: a rectangle is being drawn. */
      active: boolean;
      before: readonly string[];
    }
  | { tool: 'draw-zone'; state: 'idle'; hover: StitchPoint | null; hoverPanelId: string | null }
  | {
      tool: 'draw-zone';
      state: 'drawing';
      panelId: string;
      points: readonly StitchPoint[];
      hover: StitchPoint | null;
      /** The pointer is over the first point and the polygon could be closed there. */
      overFirst: boolean;
      problem: DrawProblem | null;
    }
  | { tool: 'pan'; state: 'idle' }
  | { tool: 'pan'; state: 'panning'; last: ScreenPoint }
  | { tool: 'zoom'; state: 'idle' };

/** A temporary pan over any tool: space held, or the middle button. */
export interface PanGesture {
  last: ScreenPoint;
  button: number;
}

/** Settings for zones the draw tool creates. */
export interface DrawDefaults {
  fn: ZoneFunction;
  /** Texture of new zones; null = the panel's base texture until the designer picks one. */
  textureId: string | null;
}

export interface EditorState {
  readonly doc: BodyMapDocument;
  readonly selection: Selection;
  readonly tool: ToolState;
  readonly camera: Camera;
  readonly viewport: Viewport;
  readonly snapping: Snapping;
  readonly textures: TextureLookup;
  /** Gap between panels in the layout, in cm of fabric. */
  readonly panelGapCm: number;
  /** Cut-outline points can be picked and dragged with the select tool. */
  readonly editOutline: boolean;
  readonly drawDefaults: DrawDefaults;
  /** Space is held down: a left-button drag pans. */
  readonly spaceHeld: boolean;
  readonly panGesture: PanGesture | null;
  /** Roles that may not edit: every change to the document is refused. */
  readonly readOnly: boolean;
  /** Bumped on every document change (edits, undo, redo). */
  readonly revision: number;
  /** The revision that was last saved (see `Editor.markSaved`). */
  readonly savedRevision: number;
  readonly canUndo: boolean;
  readonly canRedo: boolean;
  readonly undoLabel: string | null;
  readonly redoLabel: string | null;
  /** Label of the drag in progress, if any: autosave can wait for it to end. */
  readonly gesture: string | null;
  readonly helpOpen: boolean;
  /** Why the last action was refused, for a status line ("Edges would cross"); cleared on the next press or key. */
  readonly notice: string | null;
}

export interface PointerInput {
  screen: ScreenPoint;
  /** 0 = primary, 1 = middle, 2 = secondary (as in DOM pointer events). */
  button?: number;
  shift?: boolean;
  alt?: boolean;
  ctrl?: boolean;
  meta?: boolean;
}

export interface KeyInput {
  /** `KeyboardEvent.key`: 'a', 'A', 'ArrowLeft', 'Enter', ' ', 'Escape'... */
  key: string;
  ctrl?: boolean;
  meta?: boolean;
  shift?: boolean;
  alt?: boolean;
  /** A text field (zone name, search) has focus: shortcuts are off. */
  textFieldFocused?: boolean;
}

export interface WheelInput {
  screen: ScreenPoint;
  deltaX?: number;
  /** Pixels; positive scrolls down (zooms out). */
  deltaY: number;
  ctrl?: boolean;
  shift?: boolean;
}
