/**
 * A headless editor for tests: pointer and key events in, state out. Points are given in a
 * panel's stitch space and turned into screen pixels through the editor's own layout, so the
 * tests exercise the same conversions the view will.
 */
import { Editor, type EditorOptions } from '@/lib/editor/editor';
import { stitchToScreen } from '@/lib/editor/camera';
import type { BodyMapDocument, EditorState, KeyInput, TextureLookup } from '@/lib/editor/types';
import { rectanglePolygon, type Panel, type ScreenPoint, type StitchPoint, type Zone } from '@/lib/knit/panel';

export const textures: TextureLookup = {
  jersey: { repeatNeedles: 1, repeatCourses: 1, walesPerCm: 16, coursesPerCm: 20 },
  rib: { repeatNeedles: 4, repeatCourses: 2, walesPerCm: 16, coursesPerCm: 20 },
  mesh: { repeatNeedles: 6, repeatCourses: 8, walesPerCm: 14, coursesPerCm: 18 },
};

/** A front or back body panel, 240 needles × 400 courses, plain jersey base. */
export function bodyPanel(id: string, kind: 'front' | 'back', zones: Zone[] = []): Panel {
  return {
    id,
    name: kind === 'front' ? 'Front' : 'Back',
    kind,
    widthNeedles: 240,
    heightCourses: 400,
    knittedArea: rectanglePolygon(240, 400),
    cutOutline: [
      { x: 0, y: 40 },
      { x: 80, y: 0 },
      { x: 160, y: 0 },
      { x: 240, y: 40 },
      { x: 240, y: 400 },
      { x: 0, y: 400 },
    ],
    baseTextureId: 'jersey',
    zones,
  };
}

/** A rectangular zone. */
export function rectZone(id: string, x: number, y: number, w: number, h: number, extra: Partial<Zone> = {}): Zone {
  return {
    id,
    name: id,
    textureId: 'rib',
    fn: 'compression',
    order: 0,
    polygon: [
      { x, y },
      { x: x + w, y },
      { x: x + w, y: y + h },
      { x, y: y + h },
    ],
    ...extra,
  };
}

export function bodyDocument(frontZones: Zone[] = [], backZones: Zone[] = []): BodyMapDocument {
  return { version: 1, panels: [bodyPanel('front', 'front', frontZones), bodyPanel('back', 'back', backZones)] };
}

type Mods = { shift?: boolean; alt?: boolean; ctrl?: boolean; meta?: boolean; button?: number };

export class TestEditor {
  readonly editor: Editor;
  /** How many times subscribers were told of a change. */
  notifications = 0;

  constructor(options: Partial<EditorOptions> = {}) {
    let n = 0;
    this.editor = new Editor({
      doc: bodyDocument(),
      textures,
      viewport: { widthPx: 1000, heightPx: 600 },
      newId: () => `new-${++n}`,
      ...options,
    });
    // A fixed camera: 32 px/cm → a jersey needle is 2 px wide, a course 1.6 px tall.
    this.editor.setCamera({ pxPerCm: 32, pan: { x: 10, y: 10 } });
    this.editor.subscribe(() => this.notifications++);
  }

  get state(): EditorState {
    return this.editor.getState();
  }

  /** A stitch point of a panel in screen pixels under the current camera. */
  at(panelId: string, x: number, y: number): ScreenPoint {
    const layout = this.editor.layout().find((l) => l.panelId === panelId);
    if (!layout) throw new Error(`no panel ${panelId}`);
    return stitchToScreen(layout, { x, y });
  }

  pointerDown(screen: ScreenPoint, mods: Mods = {}): this {
    this.editor.pointerDown({ screen, button: 0, ...mods });
    return this;
  }

  pointerMove(screen: ScreenPoint, mods: Mods = {}): this {
    this.editor.pointerMove({ screen, button: 0, ...mods });
    return this;
  }

  pointerUp(screen: ScreenPoint, mods: Mods = {}): this {
    this.editor.pointerUp({ screen, button: 0, ...mods });
    return this;
  }

  click(screen: ScreenPoint, mods: Mods = {}): this {
    return this.pointerMove(screen, mods).pointerDown(screen, mods).pointerUp(screen, mods);
  }

  /** Press at `from`, move in `steps` steps to `to`, release. */
  drag(from: ScreenPoint, to: ScreenPoint, mods: Mods = {}, steps = 8): this {
    this.pointerDown(from, mods);
    for (let i = 1; i <= steps; i++) {
      this.pointerMove({ x: from.x + ((to.x - from.x) * i) / steps, y: from.y + ((to.y - from.y) * i) / steps }, mods);
    }
    return this.pointerUp(to, mods);
  }

  keyDown(key: string, mods: Omit<KeyInput, 'key'> = {}): boolean {
    return this.editor.keyDown({ key, ...mods });
  }

  /** Click each stitch point of a panel in turn (the draw tool places them). */
  clickPoints(panelId: string, points: readonly StitchPoint[]): this {
    for (const p of points) this.click(this.at(panelId, p.x, p.y));
    return this;
  }

  panel(id: string): Panel {
    const p = this.state.doc.panels.find((q) => q.id === id);
    if (!p) throw new Error(`no panel ${id}`);
    return p;
  }

  zone(id: string): Zone {
    for (const p of this.state.doc.panels) {
      const z = p.zones.find((q) => q.id === id);
      if (z) return z;
    }
    throw new Error(`no zone ${id}`);
  }

  hasZone(id: string): boolean {
    return this.state.doc.panels.some((p) => p.zones.some((z) => z.id === id));
  }

  /** Plain x/y pairs of a zone's polygon, for comparing. */
  points(id: string): [number, number][] {
    return this.zone(id).polygon.map((p) => [p.x, p.y]);
  }
}
