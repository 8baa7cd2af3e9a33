/**
 * Reading and updating a body-map document with structural sharing: an update returns new
 * objects only along the path to what changed, so unchanged panels and zones keep their
 * identity and a view can skip them by reference.
 */
import type { Panel, PanelKind, Zone } from '@/lib/knit/panel';
import type { BodyMapDocument } from './types';

export interface ZoneRef {
  panel: Panel;
  panelIndex: number;
  zone: Zone;
  zoneIndex: number;
}

/** The zone with this id and where it sits, or null. */
export function findZone(doc: BodyMapDocument, zoneId: string): ZoneRef | null {
  for (let panelIndex = 0; panelIndex < doc.panels.length; panelIndex++) {
    const panel = doc.panels[panelIndex]!;
    const zoneIndex = panel.zones.findIndex((z) => z.id === zoneId);
    if (zoneIndex >= 0) return { panel, panelIndex, zone: panel.zones[zoneIndex]!, zoneIndex };
  }
  return null;
}

/** The panel with this id, or null. */
export function findPanel(doc: BodyMapDocument, panelId: string): Panel | null {
  return doc.panels.find((p) => p.id === panelId) ?? null;
}

/** The panel holding this zone, or null. */
export function panelOfZone(doc: BodyMapDocument, zoneId: string): Panel | null {
  return findZone(doc, zoneId)?.panel ?? null;
}

/** The document with one panel replaced by `fn(panel)`; the same document if nothing changed. */
export function updatePanel(doc: BodyMapDocument, panelId: string, fn: (panel: Panel) => Panel): BodyMapDocument {
  const index = doc.panels.findIndex((p) => p.id === panelId);
  if (index < 0) return doc;
  const before = doc.panels[index]!;
  const after = fn(before);
  if (after === before) return doc;
  const panels = doc.panels.slice();
  panels[index] = after;
  return { ...doc, panels };
}

/**
 * The document with the given zones passed through `fn` (return the same zone for no change,
 * or null to remove it). Panels with no changed zone are kept as they are.
 */
export function updateZones(
  doc: BodyMapDocument,
  zoneIds: Iterable<string>,
  fn: (zone: Zone, panel: Panel) => Zone | null,
): BodyMapDocument {
  const ids = new Set(zoneIds);
  if (ids.size === 0) return doc;
  let panels: Panel[] | null = null;
  for (let panelIndex = 0; panelIndex < doc.panels.length; panelIndex++) {
    const panel = doc.panels[panelIndex]!;
    let zones: Zone[] | null = null;
    for (let zoneIndex = 0; zoneIndex < panel.zones.length; zoneIndex++) {
      const zone = panel.zones[zoneIndex]!;
      const next = ids.has(zone.id) ? fn(zone, panel) : zone;
      if (zones === null) {
        if (next === zone) continue;
        zones = panel.zones.slice(0, zoneIndex);
      }
      if (next) zones.push(next);
    }
    if (zones === null) continue;
    panels ??= doc.panels.slice();
    panels[panelIndex] = { ...panel, zones };
  }
  return panels ? { ...doc, panels } : doc;
}

/** The document with one zone passed through `fn`. */
export function updateZone(doc: BodyMapDocument, zoneId: string, fn: (zone: Zone, panel: Panel) => Zone | null): BodyMapDocument {
  return updateZones(doc, [zoneId], fn);
}

/** The panel kind a zone is copied to by "copy to the other panel": front ↔ back, left ↔ right. */
export function counterpartKind(kind: PanelKind): PanelKind {
  switch (kind) {
    case 'front':
      return 'back';
    case 'back':
      return 'front';
    case 'sleeve-left':
      return 'sleeve-right';
    case 'sleeve-right':
      return 'sleeve-left';
    case 'leg-left':
      return 'leg-right';
    case 'leg-right':
      return 'leg-left';
  }
}

/** The other panel of a front/back or left/right pair, or null when the style has none. */
export function counterpartPanel(doc: BodyMapDocument, panelId: string): Panel | null {
  const panel = findPanel(doc, panelId);
  if (!panel) return null;
  const kind = counterpartKind(panel.kind);
  return doc.panels.find((p) => p.kind === kind && p.id !== panel.id) ?? null;
}

/** The stacking order a zone added on top of this panel's zones gets. */
export function nextZoneOrder(panel: Panel): number {
  let max = -1;
  for (const z of panel.zones) if (z.order > max) max = z.order;
  return max + 1;
}

const drawOrderCache = new WeakMap<readonly Zone[], readonly Zone[]>();

/** A panel's zones bottom to top (ascending `order`), cached per zones array. */
export function zonesInDrawOrder(panel: Panel): readonly Zone[] {
  const cached = drawOrderCache.get(panel.zones);
  if (cached) return cached;
  const sorted = panel.zones.slice().sort((a, b) => a.order - b.order);
  drawOrderCache.set(panel.zones, sorted);
  return sorted;
}

/** Every zone id in the document. */
export function allZoneIds(doc: BodyMapDocument): Set<string> {
  const ids = new Set<string>();
  for (const p of doc.panels) for (const z of p.zones) ids.add(z.id);
  return ids;
}
