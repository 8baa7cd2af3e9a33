'use client';

import type { Editor, EditorState, ToolId } from '@/lib/editor';
import type { RulerUnit } from './body-map-canvas';

const tools: { id: ToolId; label: string; key: string; icon: string }[] = [
  { id: 'select', label: 'Select', key: 'S', icon: 'M4 3l12 6-5 1.5L9 16z' },
  { id: 'draw-zone', label: 'Draw zone', key: 'D', icon: 'M3 15l4-11 8 3-3 9zM3 15h0' },
  { id: 'pan', label: 'Pan', key: 'P', icon: 'M10 2v16M2 10h16M10 2l-3 3M10 2l3 3M10 18l-3-3M10 18l3-3M2 10l3-3M2 10l3 3M18 10l-3-3M18 10l-3 3' },
  { id: 'zoom', label: 'Zoom', key: 'Z', icon: 'M8.5 3a5.5 5.5 0 110 11 5.5 5.5 0 010-11zM12.5 12.5L17 17M6 8.5h5M8.5 6v5' },
];

function Icon({ d }: { d: string }) {
  return (
    <svg viewBox="0 0 20 20" className="h-4 w-4" fill="none" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" strokeLinejoin="round" aria-hidden>
      <path d={d} />
    </svg>
  );
}

function Btn({ children, onClick, active, disabled, title, label }: { children: React.ReactNode; onClick: () => void; active?: boolean; disabled?: boolean; title: string; label?: string }) {
  return (
    <button
      type="button"
      title={title}
      aria-label={label ?? title}
      aria-pressed={active}
      disabled={disabled}
      onClick={onClick}
      className={`inline-flex h-8 min-w-8 items-center justify-center gap-1 rounded-md border px-2 text-xs font-medium transition-colors disabled:opacity-40 ${
        active ? 'border-spruce-600 bg-spruce-600 text-white' : 'border-rule bg-panel text-ink-soft hover:border-rule-strong hover:text-ink'
      }`}
    >
      {children}
    </button>
  );
}

const Sep = () => <span className="mx-0.5 h-5 w-px bg-rule" aria-hidden />;

export function Toolbar({ editor, state, fill, onFill, rulerUnit, onRulerUnit }: {
  editor: Editor; state: EditorState; fill: 'texture' | 'flat'; onFill: (f: 'texture' | 'flat') => void;
  rulerUnit: RulerUnit; onRulerUnit: (u: RulerUnit) => void;
}) {
  const hasSel = state.selection.zoneIds.length > 0;
  const ro = state.readOnly;
  return (
    <div className="flex flex-wrap items-center gap-1" role="toolbar" aria-label="Body map tools">
      {tools.map((t) => (
        <Btn key={t.id} title={`${t.label} (${t.key})`} label={t.label} active={state.tool.tool === t.id} disabled={ro && t.id === 'draw-zone'} onClick={() => editor.setTool(t.id)}>
          <Icon d={t.icon} />
        </Btn>
      ))}
      <Sep />
      <Btn title="Zoom out (-)" onClick={() => editor.zoomOut()}>−</Btn>
      <span className="figures w-[72px] whitespace-nowrap text-center text-xs text-ink-soft" title="Screen pixels per cm of fabric">{state.camera.pxPerCm.toFixed(state.camera.pxPerCm < 10 ? 1 : 0)} px/cm</span>
      <Btn title="Zoom in (+)" onClick={() => editor.zoomIn()}>+</Btn>
      <Btn title="Fit to screen (0)" onClick={() => editor.zoomToFit()}>Fit</Btn>
      <Btn title="True size on screen (1)" onClick={() => editor.zoomToTrueSize()}>1:1</Btn>
      <Sep />
      <Btn title={`Undo${state.undoLabel ? `: ${state.undoLabel}` : ''} (Ctrl+Z)`} label="Undo" disabled={!state.canUndo || ro} onClick={() => editor.undo()}>
        <Icon d="M7 5L3 9l4 4M3 9h9a5 5 0 010 10h-2" />
      </Btn>
      <Btn title={`Redo${state.redoLabel ? `: ${state.redoLabel}` : ''} (Shift+Ctrl+Z)`} label="Redo" disabled={!state.canRedo || ro} onClick={() => editor.redo()}>
        <Icon d="M13 5l4 4-4 4M17 9H8a5 5 0 000 10h2" />
      </Btn>
      <Sep />
      <Btn title="Mirrored copy across the centre line (M)" label="Mirror" disabled={!hasSel || ro} onClick={() => editor.mirror('copy')}>Mirror</Btn>
      <Btn title="Copy to the other panel (C)" label="Copy across" disabled={!hasSel || ro} onClick={() => editor.copyToOtherPanel()}>Copy across</Btn>
      <Btn title="Size to whole repeats (R)" label="Whole repeats" disabled={!hasSel || ro} onClick={() => editor.snapToRepeats()}>Repeats</Btn>
      <Sep />
      <Btn title="Snap to the needle grid (G)" label="Snap to needles" active={state.snapping.needleGrid} onClick={() => editor.toggleSnapping('needleGrid')}>Grid</Btn>
      <Btn title="Snap to whole repeats (Shift+G)" label="Snap to repeats" active={state.snapping.wholeRepeats} onClick={() => editor.toggleSnapping('wholeRepeats')}>⊞ Repeat</Btn>
      <Btn title="Edit cut lines (L)" label="Edit cut lines" active={state.editOutline} disabled={ro} onClick={() => editor.setEditOutline(!state.editOutline)}>Cut lines</Btn>
      <Sep />
      <Btn title="Show zones as knitted texture or as flat colour" label={fill === 'texture' ? 'Flat colour view' : 'Texture view'} onClick={() => onFill(fill === 'texture' ? 'flat' : 'texture')}>
        {fill === 'texture' ? 'Texture' : 'Flat'}
      </Btn>
      <select
        aria-label="Ruler unit"
        className="h-8 rounded-md border border-rule bg-panel px-1.5 text-xs text-ink-soft"
        value={rulerUnit}
        onChange={(e) => onRulerUnit(e.target.value as RulerUnit)}
      >
        <option value="stitches">needles</option>
        <option value="cm">cm</option>
        <option value="in">in</option>
      </select>
      <Btn title="Keyboard shortcuts (?)" label="Shortcuts" active={state.helpOpen} onClick={() => editor.toggleHelp()}>?</Btn>
    </div>
  );
}
