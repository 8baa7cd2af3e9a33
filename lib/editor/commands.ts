/**
 * The body-map edits as pure functions: document in, document out. Each returns the same
 * document when it changes nothing (an unknown id, a refused edit), which the editor takes as
 * "nothing to record". Zones stay inside their panel's bounds and stay simple polygons.
 */
import { panelLimits, type Panel, type StitchPoint, type StitchPolygon, type Zone, type ZoneFunction } from '@/lib/knit/panel';
import { counterpartPanel, findPanel, findZone, nextZoneOrder, updatePanel, updateZone, updateZones, zonesInDrawOrder } from './document';
import { copyZoneToPanel, isSimplePolygon, mirrorZone, polygonBounds, translatePolygon } from './geometry';
import { clampDeltaToPanel, clampPointToPanel, clampPolygonToPanel, repeatOf } from './snapping';
import type { BodyMapDocument, DrawProblem, TextureLookup } from './types';

/** Why a polygon cannot be a zone, or null when it can. */
export function zonePolygonProblem(polygon: readonly StitchPoint[]): DrawProblem | null {
  if (polygon.length < 3) return 'too-few-points';
  if (polygon.length > panelLimits.maxVertices) return 'too-many-points';
  if (isSimplePolygon(polygon)) return null;
  return allCollinear(polygon) ? 'zero-area' : 'self-intersecting';
}

function allCollinear(points: readonly StitchPoint[]): boolean {
  const a = points[0]!;
  const b = points.find((p) => p.x !== a.x || p.y !== a.y);
  if (!b) return true;
  return points.every((p) => Math.abs((b.x - a.x) * (p.y - a.y) - (b.y - a.y) * (p.x - a.x)) < 1e-9);
}

/** Whether a panel holds as many zones as a body map may keep on one panel. */
export function panelIsFull(panel: Panel): boolean {
  return panel.zones.length >= panelLimits.maxZonesPerPanel;
}

export interface NewZone {
  id: string;
  name: string;
  textureId: string;
  fn: ZoneFunction;
}

/**
 * The document with a new zone on top of a panel's stack. The polygon is held inside the
 * panel; a polygon that is not simple (or fewer than 3 points) is refused.
 */
export function addZone(doc: BodyMapDocument, panelId: string, polygon: readonly StitchPoint[], props: NewZone): BodyMapDocument {
  return updatePanel(doc, panelId, (panel) => {
    const clamped = clampPolygonToPanel(polygon, panel);
    if (zonePolygonProblem(clamped)) return panel;
    if (panel.zones.some((z) => z.id === props.id)) return panel;
    if (panelIsFull(panel)) return panel;
    const zone: Zone = { ...props, order: nextZoneOrder(panel), polygon: clamped };
    return { ...panel, zones: [...panel.zones, zone] };
  });
}

/** The document without these zones. */
export function deleteZones(doc: BodyMapDocument, zoneIds: Iterable<string>): BodyMapDocument {
  return updateZones(doc, zoneIds, () => null);
}

/**
 * The document with zones given new polygons (id → polygon). Used by drags, which recompute
 * from the polygons at the start of the gesture; a polygon that is not simple is refused.
 */
export function setZonePolygons(doc: BodyMapDocument, polygons: Readonly<Record<string, StitchPolygon>>): BodyMapDocument {
  return updateZones(doc, Object.keys(polygons), (zone, panel) => {
    const next = polygons[zone.id];
    if (!next || next === zone.polygon) return zone;
    const clamped = clampPolygonToPanel(next, panel);
    if (!isSimplePolygon(clamped)) return zone;
    if (samePolygon(clamped, zone.polygon)) return zone;
    return { ...zone, polygon: clamped };
  });
}

function samePolygon(a: readonly StitchPoint[], b: readonly StitchPoint[]): boolean {
  return a.length === b.length && a.every((p, i) => p.x === b[i]!.x && p.y === b[i]!.y);
}

/** A zone's polygon moved by (dx, dy), cut short at the panel's edges. */
export function translateWithinPanel(polygon: readonly StitchPoint[], dx: number, dy: number, panel: Panel): StitchPolygon {
  const d = clampDeltaToPanel(polygonBounds(polygon), dx, dy, panel);
  return translatePolygon(polygon, d.dx, d.dy);
}

/** The document with zones moved by (dx needles, dy courses), each held inside its panel. */
export function moveZones(doc: BodyMapDocument, zoneIds: Iterable<string>, dx: number, dy: number): BodyMapDocument {
  if (dx === 0 && dy === 0) return doc;
  return updateZones(doc, zoneIds, (zone, panel) => {
    const polygon = translateWithinPanel(zone.polygon, dx, dy, panel);
    return samePolygon(polygon, zone.polygon) ? zone : { ...zone, polygon };
  });
}

/** How far a large nudge (Shift+arrow) goes when the zone's texture repeat is unknown. */
export const largeNudgeStitches = 10;

/**
 * The document with zones nudged one step in a direction (dirX, dirY ∈ {−1, 0, 1}): one needle
 * or course, or for a large step one repeat of each zone's texture (10 when it is unknown).
 */
export function nudgeZones(
  doc: BodyMapDocument,
  zoneIds: Iterable<string>,
  dirX: number,
  dirY: number,
  large: boolean,
  textures: TextureLookup,
): BodyMapDocument {
  return updateZones(doc, zoneIds, (zone, panel) => {
    const repeat = large ? repeatOf(textures, zone.textureId) : null;
    const sx = large ? (repeat?.needles ?? largeNudgeStitches) : 1;
    const sy = large ? (repeat?.courses ?? largeNudgeStitches) : 1;
    const polygon = translateWithinPanel(zone.polygon, dirX * sx, dirY * sy, panel);
    return samePolygon(polygon, zone.polygon) ? zone : { ...zone, polygon };
  });
}

/** The document with one vertex of a zone moved (held inside the panel; refused if edges would cross). */
export function moveVertex(doc: BodyMapDocument, zoneId: string, index: number, point: StitchPoint): BodyMapDocument {
  return updateZone(doc, zoneId, (zone, panel) => {
    if (index < 0 || index >= zone.polygon.length) return zone;
    const p = clampPointToPanel(point, panel);
    const old = zone.polygon[index]!;
    if (old.x === p.x && old.y === p.y) return zone;
    const polygon = zone.polygon.slice();
    polygon[index] = p;
    return isSimplePolygon(polygon) ? { ...zone, polygon } : zone;
  });
}

/**
 * The document with a vertex inserted into a zone so that it becomes vertex `index` (between
 * the old `index − 1` and `index`). Refused if edges would cross.
 */
export function insertVertex(doc: BodyMapDocument, zoneId: string, index: number, point: StitchPoint): BodyMapDocument {
  return updateZone(doc, zoneId, (zone, panel) => {
    if (index < 0 || index > zone.polygon.length || zone.polygon.length >= panelLimits.maxVertices) return zone;
    const polygon = zone.polygon.slice();
    polygon.splice(index, 0, clampPointToPanel(point, panel));
    return isSimplePolygon(polygon) ? { ...zone, polygon } : zone;
  });
}

/** The document with a vertex removed from a zone; a zone keeps at least 3 vertices. */
export function deleteVertex(doc: BodyMapDocument, zoneId: string, index: number): BodyMapDocument {
  return updateZone(doc, zoneId, (zone) => {
    if (zone.polygon.length <= 3 || index < 0 || index >= zone.polygon.length) return zone;
    const polygon = zone.polygon.filter((_, i) => i !== index);
    return isSimplePolygon(polygon) ? { ...zone, polygon } : zone;
  });
}

/** The document with a zone renamed (trimmed; an empty name is refused). */
export function renameZone(doc: BodyMapDocument, zoneId: string, name: string): BodyMapDocument {
  const trimmed = name.trim();
  if (!trimmed) return doc;
  return updateZone(doc, zoneId, (zone) => (zone.name === trimmed ? zone : { ...zone, name: trimmed }));
}

/** The document with zones given a function tag. */
export function setZoneFunction(doc: BodyMapDocument, zoneIds: Iterable<string>, fn: ZoneFunction): BodyMapDocument {
  return updateZones(doc, zoneIds, (zone) => (zone.fn === fn ? zone : { ...zone, fn }));
}

/**
 * The document with zones given a texture from the library. With `textures`, a zone whose tag
 * followed its old texture (the same function, or an old texture made for none) takes the new
 * texture's function; a tag the designer chose otherwise stays.
 */
export function setZoneTexture(doc: BodyMapDocument, zoneIds: Iterable<string>, textureId: string, textures?: TextureLookup): BodyMapDocument {
  const next = textures?.[textureId]?.fn ?? null;
  return updateZones(doc, zoneIds, (zone) => {
    if (zone.textureId === textureId) return zone;
    const old = textures?.[zone.textureId]?.fn ?? null;
    const follows = next !== null && (old === null || old === zone.fn);
    return follows ? { ...zone, textureId, fn: next } : { ...zone, textureId };
  });
}

/** A panel whose zones are `ordered` (bottom to top), with `order` renumbered 0…n−1. */
function withZoneOrder(panel: Panel, ordered: readonly Zone[]): Panel {
  let changed = ordered.length !== panel.zones.length;
  const zones = ordered.map((zone, i) => {
    if (panel.zones[i] !== zone) changed = true;
    if (zone.order === i) return zone;
    changed = true;
    return { ...zone, order: i };
  });
  return changed ? { ...panel, zones } : panel;
}

export type ReorderMove = 'forward' | 'backward' | 'to-front' | 'to-back';

/**
 * The document with zones moved in their panel's stack: one place up or down (past the next
 * unselected zone), or to the top or bottom. Selected zones keep their order among themselves.
 */
export function reorderZones(doc: BodyMapDocument, zoneIds: Iterable<string>, move: ReorderMove): BodyMapDocument {
  const ids = new Set(zoneIds);
  let out = doc;
  for (const panel of doc.panels) {
    if (!panel.zones.some((z) => ids.has(z.id))) continue;
    const list = zonesInDrawOrder(panel).slice();
    const sel = (z: Zone | undefined) => z !== undefined && ids.has(z.id);
    switch (move) {
      case 'forward':
        for (let i = list.length - 2; i >= 0; i--) {
          if (sel(list[i]) && !sel(list[i + 1])) [list[i], list[i + 1]] = [list[i + 1]!, list[i]!];
        }
        break;
      case 'backward':
        for (let i = 1; i < list.length; i++) {
          if (sel(list[i]) && !sel(list[i - 1])) [list[i], list[i - 1]] = [list[i - 1]!, list[i]!];
        }
        break;
      case 'to-front':
        list.sort((a, b) => Number(sel(a)) - Number(sel(b)));
        break;
      case 'to-back':
        list.sort((a, b) => Number(sel(b)) - Number(sel(a)));
        break;
    }
    out = updatePanel(out, panel.id, (p) => withZoneOrder(p, list));
  }
  return out;
}

/**
 * The document with a panel's stack set from the zone list, given top to bottom. Zones the list
 * leaves out go below the listed ones, in their present order.
 */
export function setZoneOrder(doc: BodyMapDocument, panelId: string, zoneIdsTopToBottom: readonly string[]): BodyMapDocument {
  return updatePanel(doc, panelId, (panel) => {
    const byId = new Map(panel.zones.map((z) => [z.id, z]));
    const listed: Zone[] = [];
    for (const id of zoneIdsTopToBottom) {
      const z = byId.get(id);
      if (z && !listed.includes(z)) listed.push(z);
    }
    const rest = zonesInDrawOrder(panel).filter((z) => !listed.includes(z));
    return withZoneOrder(panel, [...rest, ...listed.reverse()]);
  });
}

/** The document with zones reflected across their panel's centre line, in place. */
export function mirrorZonesInPlace(doc: BodyMapDocument, zoneIds: Iterable<string>): BodyMapDocument {
  return updateZones(doc, zoneIds, (zone, panel) => mirrorZone(zone, panel.widthNeedles));
}

/** Name given to the mirrored copy of a zone. */
export function mirroredName(name: string): string {
  return `${name} (mirror)`;
}

/**
 * The document with a mirrored copy of each zone added on top of its panel (reflected across
 * the centre line), and the new zones' ids in the order of `zoneIds`.
 */
export function addMirroredCopies(
  doc: BodyMapDocument,
  zoneIds: readonly string[],
  newId: () => string,
): { doc: BodyMapDocument; ids: string[] } {
  let out = doc;
  const ids: string[] = [];
  for (const zoneId of zoneIds) {
    const ref = findZone(out, zoneId);
    if (!ref) continue;
    const mirrored = mirrorZone(ref.zone, ref.panel.widthNeedles);
    const id = newId();
    const next = addZone(out, ref.panel.id, mirrored.polygon, {
      id,
      name: mirroredName(ref.zone.name),
      textureId: ref.zone.textureId,
      fn: ref.zone.fn,
    });
    if (next !== out) ids.push(id);
    out = next;
  }
  return { doc: out, ids };
}

/**
 * The document with a copy of each zone on the other panel of its pair (front ↔ back,
 * left ↔ right), on top of that panel's stack; and the new ids. Panels of the same width keep
 * the needles and courses; a narrower or wider panel scales the needles so the zone keeps its
 * place relative to the edges and the centre line. Zones whose panel has no counterpart are
 * skipped.
 */
export function copyZonesToCounterpart(
  doc: BodyMapDocument,
  zoneIds: readonly string[],
  newId: () => string,
): { doc: BodyMapDocument; ids: string[] } {
  let out = doc;
  const ids: string[] = [];
  for (const zoneId of zoneIds) {
    const ref = findZone(out, zoneId);
    if (!ref) continue;
    const target = counterpartPanel(out, ref.panel.id);
    if (!target) continue;
    const copied = copyZoneToPanel(ref.zone, ref.panel, target);
    if (!copied) continue;
    const id = newId();
    const next = addZone(out, target.id, copied.polygon, {
      id,
      name: ref.zone.name,
      textureId: ref.zone.textureId,
      fn: ref.zone.fn,
    });
    if (next !== out) ids.push(id);
    out = next;
  }
  return { doc: out, ids };
}

/** A length stretched or shrunk to whole repeats (at least one), no longer than `room`. */
function wholeRepeats(length: number, repeat: number, room: number): number {
  const n = Math.max(1, Math.round(length / repeat));
  const fit = Math.floor(room / repeat);
  return Math.min(n, Math.max(1, fit)) * repeat;
}

/**
 * The document with each zone scaled about its bounding box's top-left corner so that its width
 * and height are whole repeats of its texture (the nearest count, at least one), shifted back
 * inside the panel if it grew past an edge. With `roundToGrid` the vertices then land on whole
 * needles and courses where that keeps the polygon simple. Zones whose texture repeat is not
 * in the lookup are left alone.
 */
export function snapZonesToRepeats(
  doc: BodyMapDocument,
  zoneIds: Iterable<string>,
  textures: TextureLookup,
  roundToGrid: boolean,
): BodyMapDocument {
  return updateZones(doc, zoneIds, (zone, panel) => {
    const repeat = repeatOf(textures, zone.textureId);
    if (!repeat) return zone;
    const b = polygonBounds(zone.polygon);
    const w = b.maxX - b.minX;
    const h = b.maxY - b.minY;
    if (w <= 0 || h <= 0) return zone;
    const w2 = Math.min(wholeRepeats(w, repeat.needles, panel.widthNeedles), panel.widthNeedles);
    const h2 = Math.min(wholeRepeats(h, repeat.courses, panel.heightCourses), panel.heightCourses);
    const left = Math.min(b.minX, panel.widthNeedles - w2);
    const top = Math.min(b.minY, panel.heightCourses - h2);
    const scaled = zone.polygon.map((p) => ({
      x: left + ((p.x - b.minX) * w2) / w,
      y: top + ((p.y - b.minY) * h2) / h,
    }));
    let polygon = scaled;
    if (roundToGrid) {
      const rounded = scaled.map((p) => ({ x: Math.round(p.x), y: Math.round(p.y) }));
      if (isSimplePolygon(rounded)) polygon = rounded;
    }
    if (!isSimplePolygon(polygon) || samePolygon(polygon, zone.polygon)) return zone;
    return { ...zone, polygon };
  });
}

/**
 * The document with one point of a panel's cut outline moved (inside the panel; refused if edges
 * would cross). A fashioned panel's knitted area follows, as in `replaceOutline`.
 */
export function moveOutlineVertex(doc: BodyMapDocument, panelId: string, index: number, point: StitchPoint): BodyMapDocument {
  const panel = findPanel(doc, panelId);
  if (!panel || index < 0 || index >= panel.cutOutline.length) return doc;
  const cutOutline = panel.cutOutline.slice();
  cutOutline[index] = point;
  return replaceOutline(doc, panelId, cutOutline);
}

/**
 * The document with a panel's cut outline replaced wholesale (from an outline drag that started at
 * `outline`). A fashioned panel's knitted area follows, as in `replaceOutline`.
 */
export function setCutOutline(doc: BodyMapDocument, panelId: string, outline: StitchPolygon): BodyMapDocument {
  return replaceOutline(doc, panelId, outline);
}

/**
 * The document with a panel's cut lines replaced by `outline`. A fashioned (flat-knit) panel, whose
 * knitted area is its outline, gets the same knitted area.
 */
export function replaceOutline(doc: BodyMapDocument, panelId: string, outline: StitchPolygon): BodyMapDocument {
  return updatePanel(doc, panelId, (panel) => {
    const clamped = clampPolygonToPanel(outline, panel);
    if (!isSimplePolygon(clamped) || samePolygon(clamped, panel.cutOutline)) return panel;
    const fashioned = samePolygon(panel.knittedArea, panel.cutOutline);
    return { ...panel, cutOutline: clamped, ...(fashioned ? { knittedArea: clamped } : {}) };
  });
}

/**
 * The document with its panels replaced by `panels` (a local copy of unsaved work), matched by
 * position: each keeps the id of the panel in its place, so a copy taken from generated panels
 * (fresh ids on every load) lands on the ones loaded now. Null when the count or the kinds of the
 * panels differ; the same document when nothing would change.
 */
export function restorePanels(doc: BodyMapDocument, panels: readonly Panel[]): BodyMapDocument | null {
  if (panels.length !== doc.panels.length || panels.some((p, i) => p.kind !== doc.panels[i]!.kind)) return null;
  const next = doc.panels.map((current, i) => {
    const copy = { ...panels[i]!, id: current.id };
    return JSON.stringify(copy) === JSON.stringify(current) ? current : copy;
  });
  return next.every((p, i) => p === doc.panels[i]) ? doc : { ...doc, panels: next };
}

/** Whether the document has a panel with this id (guards commands coming from the view). */
export function hasPanel(doc: BodyMapDocument, panelId: string): boolean {
  return findPanel(doc, panelId) !== null;
}
