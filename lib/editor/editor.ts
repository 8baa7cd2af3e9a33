/**
 * The body-map editor: one store holding the immutable `EditorState`, the undo history and the
 * tools. A view reads it with `useSyncExternalStore(editor.subscribe, editor.getState)`,
 * forwards pointer, key and wheel events, and calls the commands from its buttons and zone list.
 * Listeners hear once per event or command, and only when the state changed.
 */
import { panelLimits, type StitchPolygon, type Panel, type ScreenPoint, type StitchPoint, type ZoneFunction } from '@/lib/knit/panel';
import {
  centreOn,
  fitCamera,
  layoutOf,
  panCamera,
  panelAtScreen,
  panelLayout,
  screenToStitch as toStitch,
  stitchToScreen as toScreen,
  wheelZoomFactor,
  zoomCameraAt,
  type PanelLayout,
} from './camera';
import * as cmd from './commands';
import type { StitchBounds } from './geometry';
import { allZoneIds, findPanel, findZone } from './document';
import * as hist from './history';
import { bindShortcuts, comboOfKey, defaultShortcuts, type Shortcut } from './shortcuts';
import { defaultSnapping, repeatOf } from './snapping';
import { drawTextureId } from './tools/draw-zone/idle';
import { handlersFor, idleState } from './tools/index';
import { zoneSelection, type ToolHost } from './tools/tool';
import type {
  BodyMapDocument,
  Camera,
  DrawDefaults,
  EditorState,
  KeyInput,
  PointerInput,
  Selection,
  Snapping,
  TextureLookup,
  ToolId,
  Viewport,
  WheelInput,
} from './types';

export interface EditorOptions {
  doc: BodyMapDocument;
  textures?: TextureLookup;
  viewport?: Viewport;
  snapping?: Partial<Snapping>;
  readOnly?: boolean;
  /** Ids for new zones; random UUIDs by default. */
  newId?: () => string;
  /** The shortcut set to bind; `defaultShortcuts` unless given. */
  shortcuts?: readonly Shortcut[];
  historyLimit?: number;
  panelGapCm?: number;
  drawDefaults?: Partial<DrawDefaults>;
}

/** CSS pixels per centimetre (96 px per inch): the zoom at which fabric shows at true size. */
export const cssPxPerCm = 96 / 2.54;
/** One step of the zoom buttons. */
export const zoomStep = Math.SQRT2;

const panelFullNotice = `A panel holds at most ${panelLimits.maxZonesPerPanel} zones: some copies did not fit`;

const emptySelection: Selection = { zoneIds: [], vertex: null, outlineVertex: null };

function defaultNewId(): string {
  return globalThis.crypto.randomUUID();
}

/** The selection with ids of zones (and points) that no longer exist dropped. */
function pruneSelection(sel: Selection, doc: BodyMapDocument): Selection {
  const ids = allZoneIds(doc);
  const zoneIds = sel.zoneIds.every((id) => ids.has(id)) ? sel.zoneIds : sel.zoneIds.filter((id) => ids.has(id));
  let vertex = sel.vertex;
  if (vertex) {
    const zone = findZone(doc, vertex.zoneId)?.zone;
    if (!zone || vertex.index >= zone.polygon.length) vertex = null;
  }
  let outlineVertex = sel.outlineVertex;
  if (outlineVertex) {
    const panel = findPanel(doc, outlineVertex.panelId);
    if (!panel || outlineVertex.index >= panel.cutOutline.length) outlineVertex = null;
  }
  if (zoneIds === sel.zoneIds && vertex === sel.vertex && outlineVertex === sel.outlineVertex) return sel;
  return { zoneIds, vertex, outlineVertex };
}

/** A name for a new zone that no zone on the panel has yet: "Zone 1", "Zone 2"… */
function freshZoneName(panel: Panel): string {
  const names = new Set(panel.zones.map((z) => z.name));
  let n = panel.zones.length + 1;
  while (names.has(`Zone ${n}`)) n++;
  return `Zone ${n}`;
}

/**
 * The editor store. Create one per open body map; see the module comment for how a view uses it.
 */
export class Editor {
  /** The shortcut set, bound once; the help panel lists it. */
  readonly shortcuts: readonly Shortcut[];
  private readonly keymap: Map<string, Shortcut>;
  private readonly newId: () => string;
  private current: EditorState;
  private history: hist.History;
  private readonly listeners = new Set<() => void>();
  private depth = 0;
  private changed = false;
  private readonly host: ToolHost;

  constructor(options: EditorOptions) {
    this.shortcuts = options.shortcuts ?? defaultShortcuts;
    this.keymap = bindShortcuts(this.shortcuts);
    this.newId = options.newId ?? defaultNewId;
    this.history = hist.createHistory(options.historyLimit);
    const textures = options.textures ?? {};
    const viewport = options.viewport ?? { widthPx: 1200, heightPx: 800 };
    const panelGapCm = options.panelGapCm ?? 4;
    this.current = {
      doc: options.doc,
      selection: emptySelection,
      tool: idleState('select'),
      camera: fitCamera(options.doc.panels, textures, panelGapCm, viewport),
      viewport,
      snapping: { ...defaultSnapping, ...options.snapping },
      textures,
      panelGapCm,
      editOutline: false,
      drawDefaults: { fn: 'compression', textureId: null, ...options.drawDefaults },
      spaceHeld: false,
      panGesture: null,
      readOnly: options.readOnly ?? false,
      revision: 0,
      savedRevision: 0,
      canUndo: false,
      canRedo: false,
      undoLabel: null,
      redoLabel: null,
      gesture: null,
      helpOpen: false,
      notice: null,
    };
    this.host = this.createHost();
  }

  // ── store ────────────────────────────────────────────────────────────────────────────────

  /** The current state (same object until something changes). */
  readonly getState = (): EditorState => this.current;

  /** Listen for state changes; returns the unsubscribe function. */
  readonly subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => {
      this.listeners.delete(listener);
    };
  };

  private set(patch: Partial<EditorState>): void {
    let differs = false;
    for (const key of Object.keys(patch) as (keyof EditorState)[]) {
      if (patch[key] !== this.current[key]) {
        differs = true;
        break;
      }
    }
    if (!differs) return;
    this.current = { ...this.current, ...patch };
    this.changed = true;
  }

  /** Run a batch of updates; listeners hear once at the end if anything changed. */
  private batch<T>(fn: () => T): T {
    this.depth++;
    try {
      return fn();
    } finally {
      this.depth--;
      if (this.depth === 0 && this.changed) {
        this.changed = false;
        for (const l of [...this.listeners]) l();
      }
    }
  }

  private historyFlags(): Partial<EditorState> {
    const h = this.history;
    return {
      canUndo: h.undo.length > 0 || (h.pending?.diffs.length ?? 0) > 0,
      canRedo: h.redo.length > 0,
      undoLabel: h.pending?.diffs.length ? h.pending.label : (h.undo[h.undo.length - 1]?.label ?? null),
      redoLabel: h.redo[h.redo.length - 1]?.label ?? null,
      gesture: h.pending?.label ?? null,
    };
  }

  private setDoc(doc: BodyMapDocument): void {
    this.set({
      doc,
      revision: this.current.revision + 1,
      selection: pruneSelection(this.current.selection, doc),
      ...this.historyFlags(),
    });
  }

  /** Apply a document edit through the history. True when the document changed. */
  private change(label: string, edit: (doc: BodyMapDocument) => BodyMapDocument): boolean {
    if (this.current.readOnly) {
      this.set({ notice: 'This body map is read-only' });
      return false;
    }
    const before = this.current.doc;
    const after = edit(before);
    if (after === before) return false;
    this.history = hist.recordChange(this.history, label, before, after);
    this.setDoc(after);
    return true;
  }

  private createHost(): ToolHost {
    // eslint-disable-next-line @typescript-eslint/no-this-alias
    const ed = this;
    return {
      get state() {
        return ed.current;
      },
      setTool: (tool) => ed.set({ tool }),
      setSelection: (selection) => ed.set({ selection: pruneSelection(selection, ed.current.doc) }),
      setCamera: (camera) => ed.set({ camera }),
      beginGesture: (label) => {
        ed.history = hist.beginGesture(ed.history, label);
        ed.set(ed.historyFlags());
      },
      endGesture: () => {
        ed.history = hist.endGesture(ed.history);
        ed.set(ed.historyFlags());
      },
      cancelGesture: () => {
        const pendingChanged = (ed.history.pending?.diffs.length ?? 0) > 0;
        const r = hist.cancelGesture(ed.history, ed.current.doc);
        ed.history = r.history;
        if (pendingChanged) ed.setDoc(r.doc);
        else ed.set(ed.historyFlags());
      },
      change: (label, edit) => ed.change(label, edit),
      addZone: (panelId, polygon) => ed.addZone(panelId, polygon),
      notice: (notice) => ed.set({ notice }),
    };
  }

  /** Leave the active tool's current state half-way (a drag is put back, a polygon dropped). */
  private cancelTool(): void {
    handlersFor(this.current.tool).cancel(this.host);
    if (this.history.pending) this.host.cancelGesture();
    const tool = this.current.tool;
    if (tool.state !== 'idle') this.set({ tool: idleState(tool.tool) });
  }

  // ── events from the view ─────────────────────────────────────────────────────────────────

  /** A pointer press on the stage (screen pixels). Middle button, or Space held, pans. */
  pointerDown(e: PointerInput): void {
    this.batch(() => {
      if (this.current.panGesture) return;
      this.set({ notice: null });
      const button = e.button ?? 0;
      if (button === 1 || (button === 0 && this.current.spaceHeld)) {
        this.set({ panGesture: { last: e.screen, button } });
        return;
      }
      handlersFor(this.current.tool).pointerDown(this.host, e);
    });
  }

  /** A pointer move over the stage. */
  pointerMove(e: PointerInput): void {
    this.batch(() => {
      const pan = this.current.panGesture;
      if (pan) {
        this.set({
          camera: panCamera(this.current.camera, e.screen.x - pan.last.x, e.screen.y - pan.last.y),
          panGesture: { ...pan, last: e.screen },
        });
        return;
      }
      handlersFor(this.current.tool).pointerMove(this.host, e);
    });
  }

  /** A pointer release (also send it when the pointer leaves the stage mid-drag). */
  pointerUp(e: PointerInput): void {
    this.batch(() => {
      if (this.current.panGesture) {
        this.set({ panGesture: null });
        return;
      }
      handlersFor(this.current.tool).pointerUp(this.host, e);
    });
  }

  /**
   * A key press. The active tool sees it first (Enter, Backspace and Escape while drawing), then
   * the shortcuts. Nothing happens while a text field has focus. Returns true when the key was
   * used, so the view can `preventDefault()`.
   */
  keyDown(e: KeyInput): boolean {
    if (e.textFieldFocused) return false;
    return this.batch(() => {
      this.set({ notice: null });
      if (handlersFor(this.current.tool).keyDown(this.host, e)) return true;
      const shortcut = this.keymap.get(comboOfKey(e));
      if (!shortcut) return false;
      shortcut.run(this);
      return true;
    });
  }

  /** A key release: letting go of Space ends pan-while-held. */
  keyUp(e: KeyInput): boolean {
    if (e.key !== ' ' && e.key.toLowerCase() !== 'spacebar') return false;
    this.holdSpace(false);
    return true;
  }

  /** A wheel turn: zooms about the cursor; with Shift it pans sideways instead. */
  wheel(e: WheelInput): void {
    this.batch(() => {
      if (e.shift) {
        this.set({ camera: panCamera(this.current.camera, -(e.deltaX || e.deltaY), 0) });
        return;
      }
      this.set({ camera: zoomCameraAt(this.current.camera, e.screen, wheelZoomFactor(e.deltaY)) });
    });
  }

  /** Space held (true) or let go (false): while held a primary-button drag pans. */
  holdSpace(held: boolean): void {
    this.batch(() => this.set({ spaceHeld: held }));
  }

  // ── tools, selection, settings ───────────────────────────────────────────────────────────

  /** Switch tools; whatever the old tool had half done is dropped. Drawing is off when read-only. */
  setTool(tool: ToolId): void {
    this.batch(() => {
      if (tool === 'draw-zone' && this.current.readOnly) {
        this.set({ notice: 'This body map is read-only' });
        return;
      }
      const now = this.current.tool;
      if (now.tool === tool && now.state === 'idle') return;
      this.cancelTool();
      this.set({ tool: idleState(tool) });
    });
  }

  /** Select zones (replacing the selection, or adding to it). */
  select(zoneIds: readonly string[], options: { additive?: boolean } = {}): void {
    this.batch(() => {
      const ids = options.additive
        ? [...this.current.selection.zoneIds, ...zoneIds.filter((id) => !this.current.selection.zoneIds.includes(id))]
        : [...zoneIds];
      this.host.setSelection(zoneSelection(ids));
    });
  }

  /** Select one vertex of a zone (the zone becomes the selection). */
  selectVertex(zoneId: string, index: number): void {
    this.batch(() => this.host.setSelection({ zoneIds: [zoneId], vertex: { zoneId, index }, outlineVertex: null }));
  }

  /** Select every zone: on the panel of the selection, or everywhere when nothing is selected. */
  selectAll(): void {
    this.batch(() => {
      const { doc, selection } = this.current;
      const first = selection.zoneIds[0];
      const panel = first ? findZone(doc, first)?.panel : undefined;
      const ids = panel ? panel.zones.map((z) => z.id) : doc.panels.flatMap((p) => p.zones.map((z) => z.id));
      this.host.setSelection(zoneSelection(ids));
    });
  }

  /** Select nothing. */
  clearSelection(): void {
    this.batch(() => this.set({ selection: emptySelection }));
  }

  /** Change snapping settings. */
  setSnapping(patch: Partial<Snapping>): void {
    this.batch(() => this.set({ snapping: { ...this.current.snapping, ...patch } }));
  }

  /** Turn one snapping setting on or off. */
  toggleSnapping(key: keyof Snapping): void {
    this.setSnapping({ [key]: !this.current.snapping[key] });
  }

  /** Turn cut-line editing on or off (cut-outline points become draggable with Select). */
  setEditOutline(on: boolean): void {
    this.batch(() => {
      if (!on && this.current.tool.tool === 'select' && this.current.tool.state === 'dragging-outline') this.cancelTool();
      this.set({ editOutline: on, selection: on ? this.current.selection : { ...this.current.selection, outlineVertex: null } });
    });
  }

  /** Replace the texture lookup (after the library loads or changes). */
  setTextures(textures: TextureLookup): void {
    this.batch(() => this.set({ textures }));
  }

  /** Function tag and texture that newly drawn zones get. */
  setDrawDefaults(patch: Partial<DrawDefaults>): void {
    this.batch(() => this.set({ drawDefaults: { ...this.current.drawDefaults, ...patch } }));
  }

  /** Make the body map read-only (no document changes) or editable. */
  setReadOnly(readOnly: boolean): void {
    this.batch(() => {
      if (readOnly) {
        this.cancelTool();
        if (this.current.tool.tool === 'draw-zone') this.set({ tool: idleState('select') });
      }
      this.set({ readOnly });
    });
  }

  /** Show or hide the shortcut help panel. */
  toggleHelp(): void {
    this.batch(() => this.set({ helpOpen: !this.current.helpOpen }));
  }

  // ── camera (never recorded in history) ───────────────────────────────────────────────────

  /** The stage size in pixels (call on mount and resize). */
  setViewport(viewport: Viewport): void {
    this.batch(() => this.set({ viewport }));
  }

  /** Set the camera directly. */
  setCamera(camera: Camera): void {
    this.batch(() => this.set({ camera }));
  }

  /** Move the view by a screen-pixel offset. */
  panBy(dxPx: number, dyPx: number): void {
    this.batch(() => this.set({ camera: panCamera(this.current.camera, dxPx, dyPx) }));
  }

  /** Zoom by a factor about a screen point, which stays over the same stitch. */
  zoomAt(screen: ScreenPoint, factor: number): void {
    this.batch(() => this.set({ camera: zoomCameraAt(this.current.camera, screen, factor) }));
  }

  private viewportCentre(): ScreenPoint {
    return { x: this.current.viewport.widthPx / 2, y: this.current.viewport.heightPx / 2 };
  }

  /** Zoom in one step about the middle of the viewport. */
  zoomIn(): void {
    this.zoomAt(this.viewportCentre(), zoomStep);
  }

  /** Zoom out one step about the middle of the viewport. */
  zoomOut(): void {
    this.zoomAt(this.viewportCentre(), 1 / zoomStep);
  }

  /** Show all panels whole, centred in the viewport. */
  zoomToFit(): void {
    this.batch(() => {
      const s = this.current;
      this.set({ camera: fitCamera(s.doc.panels, s.textures, s.panelGapCm, s.viewport) });
    });
  }

  /** Bring a place on a panel (a stitch point or box) into view, centred; zooms out only if it would not fit. Not recorded in history. */
  centreOn(panelId: string, place: StitchPoint | StitchBounds): void {
    this.batch(() => this.set({ camera: centreOn(this.current, panelId, place) }));
  }

  /** Show fabric at true size on a 96 px/in screen, about the middle of the viewport. */
  zoomToTrueSize(): void {
    this.zoomAt(this.viewportCentre(), cssPxPerCm / this.current.camera.pxPerCm);
  }

  // ── layout queries for the view ──────────────────────────────────────────────────────────

  /** Each panel's screen origin and needle/course scale under the current camera. */
  layout(): PanelLayout[] {
    return layoutOf(this.current);
  }

  /** A stitch point of a panel on screen, or null for an unknown panel. */
  stitchToScreen(panelId: string, p: StitchPoint): ScreenPoint | null {
    const l = panelLayout(this.current, panelId);
    return l ? toScreen(l, p) : null;
  }

  /** The panel under a screen point and the stitch-space point there, or null. */
  screenToStitch(screen: ScreenPoint): { panelId: string; point: StitchPoint } | null {
    const l = panelAtScreen(layoutOf(this.current), screen);
    return l ? { panelId: l.panelId, point: toStitch(l, screen) } : null;
  }

  // ── commands (each one undoable step) ────────────────────────────────────────────────────

  private ids(zoneIds?: readonly string[]): readonly string[] {
    return zoneIds ?? this.current.selection.zoneIds;
  }

  /**
   * Add a zone to a panel (on top of its stack) and select it. The polygon is held inside the
   * panel and must be simple with at least 3 points. Returns the new id, or null if refused.
   */
  addZone(
    panelId: string,
    polygon: readonly StitchPoint[],
    props: Partial<{ name: string; textureId: string; fn: ZoneFunction }> = {},
  ): string | null {
    return this.batch(() => {
      const panel = findPanel(this.current.doc, panelId);
      if (!panel) return null;
      const id = this.newId();
      const textureId = props.textureId ?? drawTextureId(this.current, panelId) ?? panel.baseTextureId;
      const zone: cmd.NewZone = {
        id,
        name: props.name ?? freshZoneName(panel),
        textureId,
        // Tagged with what its texture is made for, when the texture says.
        fn: props.fn ?? this.current.textures[textureId]?.fn ?? this.current.drawDefaults.fn,
      };
      if (!this.change('Add zone', (doc) => cmd.addZone(doc, panelId, polygon, zone))) return null;
      this.host.setSelection(zoneSelection([id]));
      return id;
    });
  }

  /** Delete zones (the selection by default). */
  deleteZones(zoneIds?: readonly string[]): void {
    this.batch(() => {
      const ids = this.ids(zoneIds);
      this.change(ids.length > 1 ? 'Delete zones' : 'Delete zone', (doc) => cmd.deleteZones(doc, ids));
    });
  }

  /** Delete the selected vertex if there is one, else the selected zones. */
  deleteSelection(): void {
    this.batch(() => {
      const v = this.current.selection.vertex;
      if (v) {
        if (!this.deleteVertex(v.zoneId, v.index)) this.set({ notice: 'A zone keeps at least 3 points' });
        else this.host.setSelection(zoneSelection(this.current.selection.zoneIds));
        return;
      }
      this.deleteZones();
    });
  }

  /** Move zones by whole or fractional needles and courses, held inside their panels. */
  moveZones(dx: number, dy: number, zoneIds?: readonly string[]): boolean {
    return this.batch(() => {
      const ids = this.ids(zoneIds);
      return this.change('Move zone', (doc) => cmd.moveZones(doc, ids, dx, dy));
    });
  }

  /**
   * Nudge the selected vertex, or else the selected zones, one step (dirX, dirY ∈ −1…1): one
   * needle/course, or when `large` one repeat of the zone's texture (10 if unknown). With
   * nothing selected, the arrows pan the view.
   */
  nudge(dirX: number, dirY: number, large: boolean): void {
    this.batch(() => {
      const { selection, doc, textures } = this.current;
      const v = selection.vertex;
      if (v) {
        const ref = findZone(doc, v.zoneId);
        const p = ref?.zone.polygon[v.index];
        if (!ref || !p) return;
        const repeat = large ? repeatOf(textures, ref.zone.textureId) : null;
        const sx = large ? (repeat?.needles ?? cmd.largeNudgeStitches) : 1;
        const sy = large ? (repeat?.courses ?? cmd.largeNudgeStitches) : 1;
        this.change('Nudge vertex', (d) => cmd.moveVertex(d, v.zoneId, v.index, { x: p.x + dirX * sx, y: p.y + dirY * sy }));
        return;
      }
      if (selection.zoneIds.length === 0) {
        const stepPx = large ? 200 : 40;
        this.panBy(-dirX * stepPx, -dirY * stepPx);
        return;
      }
      this.change('Nudge zone', (d) => cmd.nudgeZones(d, selection.zoneIds, dirX, dirY, large, textures));
    });
  }

  /** Move one vertex of a zone to a stitch point (refused if edges would cross). */
  moveVertex(zoneId: string, index: number, point: StitchPoint): boolean {
    return this.batch(() => this.change('Move vertex', (doc) => cmd.moveVertex(doc, zoneId, index, point)));
  }

  /** Insert a vertex so that it becomes vertex `index` of the zone. */
  insertVertex(zoneId: string, index: number, point: StitchPoint): boolean {
    return this.batch(() => this.change('Insert vertex', (doc) => cmd.insertVertex(doc, zoneId, index, point)));
  }

  /** Remove a vertex from a zone (a zone keeps at least 3). */
  deleteVertex(zoneId: string, index: number): boolean {
    return this.batch(() => this.change('Delete vertex', (doc) => cmd.deleteVertex(doc, zoneId, index)));
  }

  /** Rename a zone (an empty name is refused). */
  renameZone(zoneId: string, name: string): boolean {
    return this.batch(() => this.change('Rename zone', (doc) => cmd.renameZone(doc, zoneId, name)));
  }

  /** Set the function tag of zones (the selection by default). */
  setZoneFunction(fn: ZoneFunction, zoneIds?: readonly string[]): boolean {
    return this.batch(() => {
      const ids = this.ids(zoneIds);
      return this.change('Set function', (doc) => cmd.setZoneFunction(doc, ids, fn));
    });
  }

  /** Assign a texture from the studio library to zones (the selection by default). */
  setZoneTexture(textureId: string, zoneIds?: readonly string[]): boolean {
    return this.batch(() => {
      const ids = this.ids(zoneIds);
      return this.change('Set texture', (doc) => cmd.setZoneTexture(doc, ids, textureId, this.current.textures));
    });
  }

  /** Move zones (the selection by default) up or down their panel's stack. */
  reorder(move: cmd.ReorderMove, zoneIds?: readonly string[]): boolean {
    return this.batch(() => {
      const ids = this.ids(zoneIds);
      return this.change('Reorder zones', (doc) => cmd.reorderZones(doc, ids, move));
    });
  }

  /** Set a panel's stacking order from the zone list, top first. */
  setZoneOrder(panelId: string, zoneIdsTopToBottom: readonly string[]): boolean {
    return this.batch(() => this.change('Reorder zones', (doc) => cmd.setZoneOrder(doc, panelId, zoneIdsTopToBottom)));
  }

  /**
   * Mirror zones (the selection by default) across their panel's centre line: `copy` adds a
   * mirrored copy and selects it, `in-place` reflects the zones themselves.
   */
  mirror(mode: 'copy' | 'in-place', zoneIds?: readonly string[]): string[] {
    return this.batch(() => {
      const ids = this.ids(zoneIds);
      if (mode === 'in-place') {
        this.change('Mirror zone', (doc) => cmd.mirrorZonesInPlace(doc, ids));
        return [...ids];
      }
      let created: string[] = [];
      this.change('Mirror copy', (doc) => {
        const r = cmd.addMirroredCopies(doc, ids, this.newId);
        created = r.ids;
        return r.doc;
      });
      if (created.length > 0) this.host.setSelection(zoneSelection(created));
      if (created.length < ids.length && this.someFull()) this.set({ notice: panelFullNotice });
      return created;
    });
  }

  /** Whether a panel of the map holds as many zones as it may. */
  private someFull(): boolean {
    return this.current.doc.panels.some((p) => cmd.panelIsFull(p));
  }

  /** Copy zones (the selection by default) to the other panel of their pair and select the copies. */
  copyToOtherPanel(zoneIds?: readonly string[]): string[] {
    return this.batch(() => {
      const ids = this.ids(zoneIds);
      let created: string[] = [];
      this.change('Copy to other panel', (doc) => {
        const r = cmd.copyZonesToCounterpart(doc, ids, this.newId);
        created = r.ids;
        return r.doc;
      });
      if (created.length > 0) this.host.setSelection(zoneSelection(created));
      if (created.length < ids.length && this.someFull()) this.set({ notice: panelFullNotice });
      else if (created.length === 0 && ids.length > 0) this.set({ notice: 'No other panel to copy to' });
      return created;
    });
  }

  /** Size zones (the selection by default) to whole repeats of their textures. */
  snapToRepeats(zoneIds?: readonly string[]): boolean {
    return this.batch(() => {
      const ids = this.ids(zoneIds);
      const { textures, snapping } = this.current;
      return this.change('Size to whole repeats', (doc) => cmd.snapZonesToRepeats(doc, ids, textures, snapping.needleGrid));
    });
  }

  /** Move one point of a panel's cut outline (refused if the outline would cross itself). */
  /** Replace a panel's cut lines (e.g. from an uploaded outline); a fashioned panel's knitted area follows. */
  replaceOutline(panelId: string, outline: StitchPolygon): boolean {
    return this.batch(() => this.change('Replace cut lines', (doc) => cmd.replaceOutline(doc, panelId, outline)));
  }

  moveOutlinePoint(panelId: string, index: number, point: StitchPoint): boolean {
    return this.batch(() => this.change('Move cut-line point', (doc) => cmd.moveOutlineVertex(doc, panelId, index, point)));
  }

  // ── history ──────────────────────────────────────────────────────────────────────────────

  /** Undo the last step; during a drag, undo only puts the drag back. */
  undo(): boolean {
    return this.batch(() => {
      const dragged = (this.history.pending?.diffs.length ?? 0) > 0;
      this.cancelTool();
      if (dragged) return true;
      const r = hist.undo(this.history, this.current.doc);
      if (!r) return false;
      this.history = r.history;
      this.setDoc(r.doc);
      return true;
    });
  }

  /** Redo the last undone step. */
  redo(): boolean {
    return this.batch(() => {
      this.cancelTool();
      const r = hist.redo(this.history, this.current.doc);
      if (!r) return false;
      this.history = r.history;
      this.setDoc(r.doc);
      return true;
    });
  }

  // ── saving ───────────────────────────────────────────────────────────────────────────────

  /** Whether the document changed since the last `markSaved`. */
  isDirty(): boolean {
    return this.current.revision !== this.current.savedRevision;
  }

  /**
   * Record a successful save: `revision` is the state's revision when the save was sent (later
   * edits stay dirty), `version` the style version the server now holds.
   */
  markSaved(revision: number, version: number): void {
    this.batch(() => {
      const doc = this.current.doc.version === version ? this.current.doc : { ...this.current.doc, version };
      this.set({ savedRevision: Math.max(this.current.savedRevision, revision), doc });
    });
  }

  /**
   * Put a local copy of unsaved work in place of the panels, as one undoable edit (see
   * `commands.restorePanels`). False when the panels do not match or nothing changed.
   */
  restorePanels(panels: readonly Panel[]): boolean {
    return this.batch(() => this.change('Restore unsaved work', (doc) => cmd.restorePanels(doc, panels) ?? doc));
  }

  /** Replace the document (first load, or reload after a conflict): history cleared, clean. */
  loadDocument(doc: BodyMapDocument): void {
    this.batch(() => {
      this.cancelTool();
      this.history = hist.createHistory(this.history.limit);
      const revision = this.current.revision + 1;
      this.set({
        doc,
        revision,
        savedRevision: revision,
        selection: pruneSelection(this.current.selection, doc),
        ...this.historyFlags(),
      });
    });
  }
}

/** A new editor over a document. */
export function createEditor(options: EditorOptions): Editor {
  return new Editor(options);
}
