'use client';

import { useState } from 'react';
import type { BodyMapSummary } from '@/lib/knit/summary';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import { describeRuleLimits, type RuleFinding, type StudioRuleLimits } from '@/lib/rules';
import type { GarmentConsumption } from '@/lib/knit/consumption';
import type { SizeBasis } from '@/lib/knit/yarn-calculator';
import { labelCaution } from '@/lib/knit/content';

const int = new Intl.NumberFormat('en-GB');
const g1 = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 1, maximumFractionDigits: 1 });

function Section({ title, children, aside }: { title: string; children: React.ReactNode; aside?: React.ReactNode }) {
  return (
    <section className="rounded-[var(--radius-card)] border border-rule bg-panel">
      <header className="flex items-center justify-between border-b border-rule px-3 py-2">
        <h2 className="text-[13px] font-semibold">{title}</h2>
        {aside}
      </header>
      <div className="px-3 py-2">{children}</div>
    </section>
  );
}

export function SummaryPanel({ summary, findings, ruleLimits, textures, yarns, onFinding, baseSize, colourOf, sizes, size, onSize, sizeGrams }: {
  summary: BodyMapSummary; findings: RuleFinding[]; ruleLimits: StudioRuleLimits; textures: ReadonlyMap<string, Texture>; yarns: readonly Yarn[];
  onFinding: (f: RuleFinding) => void; baseSize: string; colourOf: (id: string) => string;
  /** The style's sizes and the one whose grams are shown, with its grams and how they were found. */
  sizes: readonly string[]; size: string; onSize: (size: string) => void;
  sizeGrams: { basis: SizeBasis; consumption: GarmentConsumption | null };
}) {
  const [region, setRegion] = useState<'eu' | 'us'>('eu');
  const yarnName = (id: string) => yarns.find((y) => y.id === id)?.name ?? id;
  const label = summary.labels?.[region];
  const severityTone = { error: 'text-madder-700 bg-madder-50', warning: 'text-ochre-700 bg-ochre-50', info: 'text-ink-soft bg-paper' } as const;
  return (
    <>
      <Section title="Stitches and area per texture" aside={<span className="text-xs text-ink-faint">kept · cut away</span>}>
        <table className="w-full text-xs" data-testid="texture-totals">
          <thead className="text-ink-faint">
            <tr>
              <th className="py-1 text-left font-normal">Texture</th>
              <th className="text-right font-normal">kept st.</th>
              <th className="pl-2 text-right font-normal">cut away st.</th>
              <th className="pl-2 text-right font-normal">kept</th>
              <th className="pl-2 text-right font-normal">cut away</th>
            </tr>
          </thead>
          <tbody>
            {summary.textures.map((t) => (
              <tr key={t.textureId} className="border-b border-rule/60 last:border-0">
                <td className="py-1 pr-2">
                  <span className="mr-1.5 inline-block h-2.5 w-2.5 rounded-sm align-middle ring-1 ring-ink/20" style={{ background: colourOf(t.textureId) }} />
                  {textures.get(t.textureId)?.name ?? 'Unknown'}
                </td>
                <td className="figures py-1 text-right">{int.format(t.inside)}</td>
                <td className="figures py-1 pl-2 text-right text-ink-faint">{int.format(t.outside)}</td>
                <td className="figures py-1 pl-2 text-right">{g1.format(t.insideCm2 / 100)} dm²</td>
                <td className="figures py-1 pl-2 text-right text-ink-faint">{g1.format(t.outsideCm2 / 100)} dm²</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Section>

      <Section
        title="Yarn per garment"
        aside={
          <label className="flex items-center gap-1.5 text-xs text-ink-faint">
            Size
            <select aria-label="Size for the yarn grams" className="h-6 rounded border border-rule bg-panel px-1 text-xs text-ink" value={size} onChange={(e) => onSize(e.target.value)}>
              {sizes.map((s) => <option key={s} value={s}>{s === baseSize ? `${s} (drawn)` : s}</option>)}
            </select>
            · 5 % waste allowance
          </label>
        }
      >
        {sizeGrams.consumption ? (
          <>
          {sizeGrams.basis === 'graded' ? (
            <p className="mb-1 text-[11px] text-ink-soft" data-testid="size-basis">Size {size}: the map drawn at {baseSize}, each panel graded by the size spec.</p>
          ) : sizeGrams.basis === 'base-grams' ? (
            <p className="mb-1 text-[11px] text-ochre-700" data-testid="size-basis">≈ No graded size spec for {size} yet (Fit section): size {baseSize}&apos;s grams.</p>
          ) : null}
          <table className="w-full text-xs" data-testid="yarn-grams" data-size={size}>
            <thead className="text-ink-faint">
              <tr><th className="py-1 text-left font-normal">Yarn</th><th className="text-right font-normal">kept g</th><th className="text-right font-normal">knitted g</th><th className="text-right font-normal">to buy g</th></tr>
            </thead>
            <tbody>
              {Object.entries(sizeGrams.consumption.yarns).map(([id, y]) => (
                <tr key={id} className="border-t border-rule/60">
                  <td className="py-1 pr-2">{yarnName(id)}</td>
                  <td className="figures text-right">{g1.format(y.keptGrams)}</td>
                  <td className="figures text-right">{g1.format(y.knittedGrams)}</td>
                  <td className="figures text-right font-semibold">{g1.format(y.grossGrams)}</td>
                </tr>
              ))}
              <tr className="border-t border-rule font-semibold">
                <td className="py-1">Garment</td>
                <td className="figures text-right">{g1.format(sizeGrams.consumption.keptGrams)}</td>
                <td className="figures text-right">{g1.format(sizeGrams.consumption.knittedGrams)}</td>
                <td className="figures text-right">{g1.format(sizeGrams.consumption.grossGrams)}</td>
              </tr>
            </tbody>
          </table>
          </>
        ) : (
          <p className="text-xs text-ink-soft">{summary.problems[0] ?? 'Assign textures to see the yarn.'}</p>
        )}
      </Section>

      <Section
        title="Fibre content"
        aside={
          <div className="flex overflow-hidden rounded border border-rule text-xs" role="group" aria-label="Label region">
            {(['eu', 'us'] as const).map((r) => (
              <button key={r} type="button" aria-pressed={region === r} className={`px-2 py-0.5 ${region === r ? 'bg-spruce-600 text-white' : 'text-ink-soft'}`} onClick={() => setRegion(r)}>
                {r.toUpperCase()}
              </button>
            ))}
          </div>
        }
      >
        {label ? (
          <div className="space-y-2">
            <p className="text-sm font-semibold" data-testid="content-label">{label.text}</p>
            <ul className="space-y-0.5 text-xs text-ink-soft">
              {label.lines.map((l) => (
                <li key={l.name} className="flex justify-between"><span>{l.name}</span><span className="figures">{l.exactPercent.toFixed(2)} % → {l.percent} %</span></li>
              ))}
            </ul>
            {label.notes.filter((n) => n !== labelCaution).map((n) => <p key={n} className="text-xs text-ochre-700">{n}</p>)}
            <p className="rounded bg-paper px-2 py-1 text-[11px] leading-4 text-ink-soft">{labelCaution}</p>
          </div>
        ) : (
          <p className="text-xs text-ink-soft">No content yet.</p>
        )}
      </Section>

      <Section title="Findings" aside={<span className="figures text-xs text-ink-faint">{findings.length}</span>}>
        {findings.length === 0 ? (
          <p className="text-xs text-spruce-700">No findings: the rules pass.</p>
        ) : (
          <ul className="space-y-1" data-testid="findings">
            {findings.map((f, i) => (
              <li key={i}>
                <button type="button" onClick={() => onFinding(f)} className={`w-full rounded px-2 py-1 text-left text-xs ${severityTone[f.severity]}`}>
                  {f.message}
                </button>
              </li>
            ))}
          </ul>
        )}
        <p className="mt-2 text-2xs text-ink-faint" data-testid="rule-limits">Limits: {describeRuleLimits(ruleLimits)}.</p>
      </Section>
    </>
  );
}
