/**
 * Undo history as diffs of panels. Documents are immutable and share structure, so a diff is
 * the before and after reference of each panel that changed: cheap to keep and exact to undo.
 *
 * A gesture (a drag) opens a stopping point with `beginGesture`; every change until
 * `endGesture` is folded into one entry that keeps the first `before` and the last `after` of
 * each panel. Camera and selection never pass through here.
 */
import type { Panel } from '@/lib/knit/panel';
import type { BodyMapDocument } from './types';

export interface PanelDiff {
  panelId: string;
  before: Panel;
  after: Panel;
}

export interface HistoryEntry {
  label: string;
  diffs: readonly PanelDiff[];
}

export interface History {
  readonly undo: readonly HistoryEntry[];
  readonly redo: readonly HistoryEntry[];
  /** The entry a gesture in progress is collecting into, or null. */
  readonly pending: HistoryEntry | null;
  readonly limit: number;
}

/** An empty history keeping at most `limit` entries. */
export function createHistory(limit = 200): History {
  return { undo: [], redo: [], pending: null, limit };
}

/** The panels that differ by reference between two documents with the same panel ids. */
export function diffDocuments(before: BodyMapDocument, after: BodyMapDocument): PanelDiff[] {
  if (before.panels === after.panels) return [];
  if (before.panels.length !== after.panels.length) {
    throw new Error('history: panels were added or removed; load the document instead');
  }
  const diffs: PanelDiff[] = [];
  before.panels.forEach((b, i) => {
    const a = after.panels[i]!;
    if (a.id !== b.id) throw new Error('history: panels were reordered; load the document instead');
    if (a !== b) diffs.push({ panelId: a.id, before: b, after: a });
  });
  return diffs;
}

/** Fold later diffs into earlier ones: first `before`, last `after`; no-op diffs dropped. */
function mergeDiffs(earlier: readonly PanelDiff[], later: readonly PanelDiff[]): PanelDiff[] {
  const byId = new Map<string, PanelDiff>();
  for (const d of earlier) byId.set(d.panelId, d);
  for (const d of later) {
    const prev = byId.get(d.panelId);
    byId.set(d.panelId, prev ? { panelId: d.panelId, before: prev.before, after: d.after } : d);
  }
  return [...byId.values()].filter((d) => d.before !== d.after);
}

function push(history: History, entry: HistoryEntry): History {
  const undo = [...history.undo, entry];
  if (undo.length > history.limit) undo.splice(0, undo.length - history.limit);
  return { ...history, undo, redo: [] };
}

/**
 * Record a change from `before` to `after`: into the open gesture if there is one, else as an
 * entry of its own. Clears the redo stack.
 */
export function recordChange(history: History, label: string, before: BodyMapDocument, after: BodyMapDocument): History {
  const diffs = diffDocuments(before, after);
  if (diffs.length === 0) return history;
  if (history.pending) {
    return { ...history, pending: { label: history.pending.label, diffs: mergeDiffs(history.pending.diffs, diffs) } };
  }
  return push(history, { label, diffs });
}

/** Open a stopping point: changes until `endGesture` become one entry labelled `label`. */
export function beginGesture(history: History, label: string): History {
  const closed = endGesture(history);
  return { ...closed, pending: { label, diffs: [] } };
}

/** Close the open gesture, keeping it as one entry if it changed anything. */
export function endGesture(history: History): History {
  const pending = history.pending;
  if (!pending) return history;
  const base = { ...history, pending: null };
  const diffs = pending.diffs.filter((d) => d.before !== d.after);
  return diffs.length > 0 ? push(base, { label: pending.label, diffs }) : base;
}

/** Apply each diff's `before` (undo) or `after` (redo) to a document. */
export function applyDiffs(doc: BodyMapDocument, diffs: readonly PanelDiff[], side: 'before' | 'after'): BodyMapDocument {
  if (diffs.length === 0) return doc;
  const byId = new Map(diffs.map((d) => [d.panelId, d[side]]));
  return { ...doc, panels: doc.panels.map((p) => byId.get(p.id) ?? p) };
}

/**
 * Drop the open gesture and return the document as it was when the gesture began
 * (Escape during a drag).
 */
export function cancelGesture(history: History, doc: BodyMapDocument): { history: History; doc: BodyMapDocument } {
  if (!history.pending) return { history, doc };
  return { history: { ...history, pending: null }, doc: applyDiffs(doc, history.pending.diffs, 'before') };
}

/** Step back one entry, or null when there is nothing to undo. Closes an open gesture first. */
export function undo(history: History, doc: BodyMapDocument): { history: History; doc: BodyMapDocument; entry: HistoryEntry } | null {
  const h = endGesture(history);
  const entry = h.undo[h.undo.length - 1];
  if (!entry) return null;
  return {
    history: { ...h, undo: h.undo.slice(0, -1), redo: [...h.redo, entry] },
    doc: applyDiffs(doc, entry.diffs, 'before'),
    entry,
  };
}

/** Step forward one entry, or null when there is nothing to redo. */
export function redo(history: History, doc: BodyMapDocument): { history: History; doc: BodyMapDocument; entry: HistoryEntry } | null {
  const h = endGesture(history);
  const entry = h.redo[h.redo.length - 1];
  if (!entry) return null;
  return {
    history: { ...h, redo: h.redo.slice(0, -1), undo: [...h.undo, entry] },
    doc: applyDiffs(doc, entry.diffs, 'after'),
    entry,
  };
}
