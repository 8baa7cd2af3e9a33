/**
 * Keyboard shortcuts as data. The editor binds the list once into a key map; the help panel
 * lists the same entries. Key combos are written lowercase with `+`: modifiers first
 * (`mod` = Ctrl, or Cmd on a Mac; `alt`; `shift`), then the key as `KeyboardEvent.key` names it
 * (`z`, `arrowleft`, `delete`, `space`, `.`). For keys that are a symbol character (`.`, `>`,
 * `?`), Shift is part of the character and is not written or matched.
 */
import type { Editor } from './editor';
import type { KeyInput } from './types';

export type ShortcutGroup = 'Tools' | 'Edit' | 'Arrange' | 'Snapping' | 'View' | 'History';

export interface Shortcut {
  id: string;
  label: string;
  group: ShortcutGroup;
  keys: readonly string[];
  run: (editor: Editor) => void;
}

const modifierOrder = ['mod', 'alt', 'shift'] as const;
type Modifier = (typeof modifierOrder)[number];

/** A symbol character: Shift only selects it, so it is not part of the combo. */
function isSymbol(key: string): boolean {
  return key.length === 1 && !/[a-z0-9]/i.test(key) && key !== ' ';
}

function keyName(key: string): string {
  if (key === ' ' || key === 'spacebar') return 'space';
  return key.toLowerCase();
}

function canonical(mods: ReadonlySet<Modifier>, key: string): string {
  const parts: string[] = modifierOrder.filter((m) => mods.has(m) && !(m === 'shift' && isSymbol(key)));
  parts.push(key);
  return parts.join('+');
}

/** A written combo ('Shift+Mod+Z') in the canonical form the key map uses ('mod+shift+z'). */
export function normalizeCombo(spec: string): string {
  const raw = spec.trim();
  // a combo ending in '+' means the plus key itself
  const parts = raw.endsWith('+') ? [...raw.slice(0, -1).split('+').filter(Boolean), '+'] : raw.split('+');
  const key = keyName(parts.pop() ?? '');
  const mods = new Set<Modifier>();
  for (const p of parts) {
    const m = p.trim().toLowerCase();
    if (m === 'mod' || m === 'ctrl' || m === 'cmd' || m === 'meta') mods.add('mod');
    else if (m === 'alt' || m === 'option') mods.add('alt');
    else if (m === 'shift') mods.add('shift');
    else throw new Error(`shortcut: unknown modifier "${p}" in "${spec}"`);
  }
  return canonical(mods, key);
}

/** The canonical combo of a key event. */
export function comboOfKey(e: KeyInput): string {
  const mods = new Set<Modifier>();
  if (e.ctrl || e.meta) mods.add('mod');
  if (e.alt) mods.add('alt');
  if (e.shift) mods.add('shift');
  return canonical(mods, keyName(e.key));
}

/** Bind shortcuts into a combo → shortcut map. Two shortcuts on one combo is an error. */
export function bindShortcuts(shortcuts: readonly Shortcut[]): Map<string, Shortcut> {
  const map = new Map<string, Shortcut>();
  for (const s of shortcuts) {
    for (const k of s.keys) {
      const combo = normalizeCombo(k);
      const taken = map.get(combo);
      if (taken) throw new Error(`shortcut: "${k}" is bound to both ${taken.id} and ${s.id}`);
      map.set(combo, s);
    }
  }
  return map;
}

const keyLabels: Record<string, string> = {
  arrowleft: '←',
  arrowright: '→',
  arrowup: '↑',
  arrowdown: '↓',
  space: 'Space',
  delete: 'Delete',
  backspace: 'Backspace',
  escape: 'Esc',
  enter: 'Enter',
};

/** A combo as the help panel shows it: '⌘⇧Z' on a Mac, 'Ctrl+Shift+Z' elsewhere. */
export function describeCombo(spec: string, platform: 'mac' | 'other'): string {
  const parts = normalizeCombo(spec).split('+');
  const key = parts.pop() ?? '';
  const keyText = keyLabels[key] ?? (key.length === 1 ? key.toUpperCase() : key);
  const names: Record<Modifier, [string, string]> = { mod: ['⌘', 'Ctrl'], alt: ['⌥', 'Alt'], shift: ['⇧', 'Shift'] };
  const mods = parts.map((m) => names[m as Modifier][platform === 'mac' ? 0 : 1]);
  return platform === 'mac' ? [...mods, keyText].join('') : [...mods, keyText].join('+');
}

const arrows = [
  { key: 'arrowleft', dx: -1, dy: 0, name: 'left' },
  { key: 'arrowright', dx: 1, dy: 0, name: 'right' },
  { key: 'arrowup', dx: 0, dy: -1, name: 'up' },
  { key: 'arrowdown', dx: 0, dy: 1, name: 'down' },
] as const;

/** The body map's own shortcut set. */
export const defaultShortcuts: readonly Shortcut[] = [
  { id: 'tool.select', label: 'Select and move', group: 'Tools', keys: ['s'], run: (ed) => ed.setTool('select') },
  { id: 'tool.draw-zone', label: 'Draw zone', group: 'Tools', keys: ['d'], run: (ed) => ed.setTool('draw-zone') },
  { id: 'tool.pan', label: 'Pan', group: 'Tools', keys: ['p'], run: (ed) => ed.setTool('pan') },
  { id: 'tool.zoom', label: 'Zoom (Alt+click zooms out)', group: 'Tools', keys: ['z'], run: (ed) => ed.setTool('zoom') },
  { id: 'view.hold-pan', label: 'Pan while held', group: 'View', keys: ['space'], run: (ed) => ed.holdSpace(true) },

  { id: 'edit.delete', label: 'Delete zones, or the selected vertex', group: 'Edit', keys: ['delete', 'backspace'], run: (ed) => ed.deleteSelection() },
  { id: 'edit.select-all', label: 'Select all zones', group: 'Edit', keys: ['mod+a'], run: (ed) => ed.selectAll() },
  { id: 'edit.deselect', label: 'Clear the selection', group: 'Edit', keys: ['escape'], run: (ed) => ed.clearSelection() },
  { id: 'edit.mirror-copy', label: 'Mirrored copy across the centre line', group: 'Edit', keys: ['m'], run: (ed) => ed.mirror('copy') },
  { id: 'edit.mirror-in-place', label: 'Mirror in place', group: 'Edit', keys: ['shift+m'], run: (ed) => ed.mirror('in-place') },
  { id: 'edit.copy-to-other-panel', label: 'Copy to the other panel (front ↔ back)', group: 'Edit', keys: ['c'], run: (ed) => ed.copyToOtherPanel() },
  { id: 'edit.fit-repeats', label: 'Size zone to whole repeats', group: 'Edit', keys: ['r'], run: (ed) => ed.snapToRepeats() },
  ...arrows.flatMap((a): Shortcut[] => [
    { id: `edit.nudge-${a.name}`, label: `Nudge ${a.name} one needle or course`, group: 'Edit', keys: [a.key], run: (ed) => ed.nudge(a.dx, a.dy, false) },
    { id: `edit.nudge-${a.name}-large`, label: `Nudge ${a.name} one repeat (or 10)`, group: 'Edit', keys: [`shift+${a.key}`], run: (ed) => ed.nudge(a.dx, a.dy, true) },
  ]),

  { id: 'arrange.forward', label: 'Bring forward', group: 'Arrange', keys: ['.'], run: (ed) => ed.reorder('forward') },
  { id: 'arrange.backward', label: 'Send backward', group: 'Arrange', keys: [','], run: (ed) => ed.reorder('backward') },
  { id: 'arrange.to-front', label: 'Bring to front', group: 'Arrange', keys: ['>'], run: (ed) => ed.reorder('to-front') },
  { id: 'arrange.to-back', label: 'Send to back', group: 'Arrange', keys: ['<'], run: (ed) => ed.reorder('to-back') },

  { id: 'snap.needle-grid', label: 'Snap to needles and courses on/off', group: 'Snapping', keys: ['g'], run: (ed) => ed.toggleSnapping('needleGrid') },
  { id: 'snap.whole-repeats', label: 'Snap to whole repeats on/off', group: 'Snapping', keys: ['shift+g'], run: (ed) => ed.toggleSnapping('wholeRepeats') },
  { id: 'edit.cut-lines', label: 'Edit cut lines on/off', group: 'Edit', keys: ['l'], run: (ed) => ed.setEditOutline(!ed.getState().editOutline) },

  { id: 'view.zoom-in', label: 'Zoom in', group: 'View', keys: ['=', '+'], run: (ed) => ed.zoomIn() },
  { id: 'view.zoom-out', label: 'Zoom out', group: 'View', keys: ['-'], run: (ed) => ed.zoomOut() },
  { id: 'view.fit', label: 'Fit all panels', group: 'View', keys: ['0'], run: (ed) => ed.zoomToFit() },
  { id: 'view.true-size', label: 'True size (1 cm on screen per cm of fabric)', group: 'View', keys: ['1'], run: (ed) => ed.zoomToTrueSize() },
  { id: 'view.help', label: 'Show shortcuts', group: 'View', keys: ['?'], run: (ed) => ed.toggleHelp() },

  { id: 'history.undo', label: 'Undo', group: 'History', keys: ['mod+z'], run: (ed) => ed.undo() },
  { id: 'history.redo', label: 'Redo', group: 'History', keys: ['mod+shift+z', 'mod+y'], run: (ed) => ed.redo() },
];
