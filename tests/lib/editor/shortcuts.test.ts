import { describe, expect, it } from 'vitest';
import { bindShortcuts, comboOfKey, defaultShortcuts, describeCombo, normalizeCombo } from '@/lib/editor/shortcuts';
import { TestEditor, bodyDocument, rectZone } from './test-editor';

describe('shortcut data', () => {
  it('has unique ids and labels, and binds without clashes', () => {
    const ids = defaultShortcuts.map((s) => s.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const s of defaultShortcuts) {
      expect(s.label.length).toBeGreaterThan(0);
      expect(s.keys.length).toBeGreaterThan(0);
    }
    expect(() => bindShortcuts(defaultShortcuts)).not.toThrow();
  });

  it('refuses two shortcuts on one key', () => {
    const run = () => {};
    expect(() =>
      bindShortcuts([
        { id: 'one', label: 'One', group: 'Edit', keys: ['mod+k'], run },
        { id: 'two', label: 'Two', group: 'Edit', keys: ['Ctrl+K'], run },
      ]),
    ).toThrow(/both one and two/);
  });

  it('writes combos in one canonical form', () => {
    expect(normalizeCombo('Shift+Ctrl+Z')).toBe('mod+shift+z');
    expect(normalizeCombo('cmd+y')).toBe('mod+y');
    expect(normalizeCombo('shift+>')).toBe('>');
    expect(normalizeCombo('mod++')).toBe('mod++');
    expect(comboOfKey({ key: 'Z', meta: true, shift: true })).toBe('mod+shift+z');
    expect(comboOfKey({ key: '>', shift: true })).toBe('>');
    expect(comboOfKey({ key: ' ' })).toBe('space');
    expect(comboOfKey({ key: 'ArrowLeft', shift: true })).toBe('shift+arrowleft');
  });

  it('describes combos for the help panel', () => {
    expect(describeCombo('mod+shift+z', 'mac')).toBe('⌘⇧Z');
    expect(describeCombo('mod+shift+z', 'other')).toBe('Ctrl+Shift+Z');
    expect(describeCombo('shift+arrowup', 'other')).toBe('Shift+↑');
  });
});

describe('shortcuts in the editor', () => {
  it('switches tools with their letters', () => {
    const t = new TestEditor();
    expect(t.keyDown('d')).toBe(true);
    expect(t.state.tool.tool).toBe('draw-zone');
    t.keyDown('p');
    expect(t.state.tool.tool).toBe('pan');
    t.keyDown('z');
    expect(t.state.tool.tool).toBe('zoom');
    t.keyDown('S', { shift: false });
    expect(t.state.tool.tool).toBe('select');
  });

  it('is off while a text field has focus', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 40, 60)]) });
    t.editor.select(['a']);
    const state = t.state;
    const heard = t.notifications;
    for (const key of ['d', 'Delete', 'Backspace', 'ArrowLeft', 'm', 'z', ' ']) {
      expect(t.keyDown(key, { textFieldFocused: true })).toBe(false);
    }
    expect(t.keyDown('z', { ctrl: true, textFieldFocused: true })).toBe(false);
    expect(t.state).toBe(state);
    expect(t.notifications).toBe(heard);
    // and on again once the field loses focus
    t.keyDown('Delete');
    expect(t.hasZone('a')).toBe(false);
  });

  it('does not take letters typed with Ctrl or Cmd', () => {
    const t = new TestEditor();
    expect(t.keyDown('d', { ctrl: true })).toBe(false);
    expect(t.keyDown('d', { meta: true })).toBe(false);
    expect(t.state.tool.tool).toBe('select');
  });

  it('undoes and redoes with Ctrl/Cmd+Z, Shift+Ctrl/Cmd+Z and Ctrl+Y', () => {
    const t = new TestEditor({ doc: bodyDocument([rectZone('a', 20, 30, 40, 60)]) });
    t.editor.moveZones(1, 0, ['a']);
    t.editor.moveZones(1, 0, ['a']);
    const x = () => t.zone('a').polygon[0]!.x;
    t.keyDown('z', { ctrl: true });
    expect(x()).toBe(21);
    t.keyDown('z', { meta: true });
    expect(x()).toBe(20);
    t.keyDown('Z', { ctrl: true, shift: true });
    expect(x()).toBe(21);
    t.keyDown('y', { ctrl: true });
    expect(x()).toBe(22);
    t.keyDown('z', { meta: true });
    t.keyDown('z', { meta: true, shift: true });
    expect(x()).toBe(22);
  });

  it('toggles snapping, cut-line editing and the help panel', () => {
    const t = new TestEditor();
    t.keyDown('g');
    expect(t.state.snapping).toEqual({ needleGrid: false, wholeRepeats: false });
    t.keyDown('G', { shift: true });
    expect(t.state.snapping).toEqual({ needleGrid: false, wholeRepeats: true });
    t.keyDown('l');
    expect(t.state.editOutline).toBe(true);
    t.keyDown('?', { shift: true });
    expect(t.state.helpOpen).toBe(true);
  });

  it('binds a custom shortcut set given to the editor', () => {
    let ran = 0;
    const t = new TestEditor({ shortcuts: [{ id: 'x', label: 'X', group: 'Edit', keys: ['x'], run: () => ran++ }] });
    expect(t.keyDown('x')).toBe(true);
    expect(t.keyDown('d')).toBe(false);
    expect(ran).toBe(1);
    expect(t.editor.shortcuts.map((s) => s.id)).toEqual(['x']);
  });
});
