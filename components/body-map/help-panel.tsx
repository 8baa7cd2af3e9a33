'use client';

import { describeCombo, type Editor, type ShortcutGroup } from '@/lib/editor';

export function HelpPanel({ editor }: { editor: Editor }) {
  const mac = typeof navigator !== 'undefined' && /Mac/.test(navigator.platform);
  const groups = new Map<ShortcutGroup, typeof editor.shortcuts[number][]>();
  for (const s of editor.shortcuts) groups.set(s.group, [...(groups.get(s.group) ?? []), s]);
  return (
    <div role="dialog" aria-label="Keyboard shortcuts" className="absolute right-3 top-3 z-10 max-h-[85%] w-[420px] overflow-y-auto rounded-[var(--radius-card)] border border-rule bg-panel/98 p-4 shadow-lg">
      <div className="mb-2 flex items-center justify-between">
        <h2 className="text-sm font-semibold">Keyboard shortcuts</h2>
        <button type="button" className="text-xs text-ink-faint hover:text-ink" onClick={() => editor.toggleHelp()}>Close (?)</button>
      </div>
      <div className="grid grid-cols-2 gap-x-5 gap-y-3 text-xs">
        {[...groups.entries()].map(([group, list]) => (
          <section key={group}>
            <h3 className="mb-1 font-semibold uppercase tracking-[0.08em] text-ink-faint">{group}</h3>
            <dl className="space-y-0.5">
              {list.map((s) => (
                <div key={s.id} className="flex justify-between gap-2">
                  <dt className="text-ink-soft">{s.label}</dt>
                  <dd className="figures whitespace-nowrap text-ink">{s.keys.map((k) => describeCombo(k, mac ? 'mac' : 'other')).join(' / ')}</dd>
                </div>
              ))}
            </dl>
          </section>
        ))}
      </div>
      <p className="mt-3 text-xs text-ink-faint">Space-drag or the middle button pans; the wheel zooms at the pointer. Draw: click points, close on the first point or press Enter; Esc cancels.</p>
    </div>
  );
}
