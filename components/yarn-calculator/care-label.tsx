'use client';

import { useState } from 'react';
import {
  careCategories, careCategoryLabels, careExtras, careLines, careStatusWords, type CareCategory, type CareChoices, type CareExtraId,
} from '@/lib/knit/care';
import { fibres } from '@/lib/knit/fibres';
import type { YarnCalculatorFigures } from '@/lib/knit/yarn-calculator';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { Input, Select } from '@/components/ui/field';

type Region = 'eu' | 'us';

/**
 * The care-label draft: fibre content, size, care instructions chosen from the options the fibres
 * allow (the strictest fibre's limit first offered), country of origin. A draft on this screen only:
 * copy it into the tech pack.
 */
export function CareLabel({ styleId, figures, sizes, baseSize }: { styleId: string; figures: YarnCalculatorFigures; sizes: readonly string[]; baseSize: string }) {
  const [region, setRegion] = useState<Region>('eu');
  const [size, setSize] = useState(baseSize);
  const [origin, setOrigin] = useState('');
  const [choices, setChoices] = useState<CareChoices>({});
  const [extras, setExtras] = useState<CareExtraId[] | null>(null);
  const [copied, setCopied] = useState(false);
  const advice = figures.care;
  const content = figures.content;
  if (!advice || !content) {
    return (
      <Card title="Care-label draft">
        <p className="text-sm text-ink-soft">No care label without fibre content: assign textures in the body map.</p>
      </Card>
    );
  }
  // A choice the fibres no longer allow (the body map changed) falls back to the limit.
  const valid: CareChoices = {};
  for (const c of careCategories) {
    const id = choices[c];
    if (id && advice.categories[c].allowed.some((o) => o.id === id)) valid[c] = id;
  }
  const chosenExtras = extras ?? advice.extras;
  const lines = careLines(advice, region, valid, chosenExtras);
  const contentText = content.labels[region].text;
  const originLine = origin.trim() ? `Made in ${origin.trim()}` : null;
  const fullText = [contentText, `Size ${size}`, ...lines, ...(originLine ? [originLine] : [])].join('\n');

  return (
    <Card
      title="Care-label draft"
      actions={
        <div className="flex overflow-hidden rounded-md border border-rule-strong text-xs" role="group" aria-label="Care label region">
          {(['eu', 'us'] as const).map((r) => (
            <button key={r} type="button" aria-pressed={region === r} onClick={() => setRegion(r)} className={`px-2.5 py-1 font-medium ${region === r ? 'bg-spruce-600 text-white' : 'bg-panel text-ink-soft'}`}>
              {r === 'eu' ? 'EU wording' : 'US wording'}
            </button>
          ))}
        </div>
      }
    >
      <div className="grid grid-cols-[280px_minmax(0,1fr)] gap-6">
        <div>
          <div className="mx-auto w-[240px] rounded-sm border border-rule-strong bg-white px-5 py-4 text-center text-[12px] leading-[1.55] text-ink shadow-[0_1px_3px_rgba(31,36,40,0.08)]" data-testid="care-label">
            <p className="font-semibold">{contentText}</p>
            <p className="figures mt-2">Size {size}</p>
            <ul className="mt-2 space-y-0.5">
              {lines.map((l) => <li key={l}>{l}</li>)}
            </ul>
            {originLine ? <p className="mt-2">{originLine}</p> : <p className="mt-2 text-ink-faint">Made in …</p>}
          </div>
          <div className="mt-3 flex justify-center">
            <Button
              size="sm"
              onClick={() => {
                void navigator.clipboard?.writeText(fullText).then(() => { setCopied(true); setTimeout(() => setCopied(false), 1500); });
              }}
            >
              {copied ? 'Copied' : 'Copy the text'}
            </Button>
          </div>
          <p className="mt-2 text-center text-[11px] text-ink-faint">A draft on this screen: it is not saved.</p>
        </div>

        <div className="min-w-0 space-y-4">
          <div className="flex flex-wrap gap-3">
            <div>
              <label htmlFor={`care-size-${styleId}`} className="block text-xs font-medium text-ink-soft">Size</label>
              <Select id={`care-size-${styleId}`} className="mt-1 w-28" value={size} onChange={(e) => setSize(e.target.value)}>
                {sizes.map((s) => <option key={s} value={s}>{s}</option>)}
              </Select>
            </div>
            <div className="w-80">
              <label htmlFor={`care-origin-${styleId}`} className="block text-xs font-medium text-ink-soft">Country of origin</label>
              <Input id={`care-origin-${styleId}`} className="mt-1" maxLength={60} placeholder="Where the garment is knitted and made" value={origin} onChange={(e) => setOrigin(e.target.value)} />
            </div>
          </div>

          <table className="w-full text-xs">
            <thead className="text-ink-faint">
              <tr className="border-b border-rule">
                <th className="w-28 py-1 text-left font-medium">Instruction</th>
                <th className="w-80 py-1 text-left font-medium">Wording</th>
                <th className="py-1 pl-3 text-left font-medium">Set by</th>
              </tr>
            </thead>
            <tbody>
              {careCategories.map((c: CareCategory) => {
                const a = advice.categories[c];
                return (
                  <tr key={c} className="border-b border-rule/60 align-top">
                    <td className="py-2 pr-2 font-medium text-ink">{careCategoryLabels[c]}</td>
                    <td className="py-1.5">
                      <Select
                        aria-label={careCategoryLabels[c]}
                        className="h-8 text-xs"
                        value={valid[c] ?? a.limit.id}
                        onChange={(e) => setChoices((ch) => ({ ...ch, [c]: e.target.value }))}
                      >
                        {[...a.allowed].reverse().map((o) => (
                          <option key={o.id} value={o.id}>{o[region]}</option>
                        ))}
                      </Select>
                    </td>
                    <td className="py-2 pl-3 leading-5 text-ink-soft">
                      {valid[c] && valid[c] !== a.limit.id ? <span className="mr-1 text-spruce-700">Stricter than the fibres need.</span> : null}
                      <span className="font-medium text-ink">Limit set by {a.decidedBy.map((f) => fibres[f].names.eu).join(', ')}</span>
                      {': '}
                      {a.why}
                      <span className="ml-1.5 whitespace-nowrap rounded bg-paper px-1.5 py-0.5 text-[10px] text-ink-faint ring-1 ring-rule">{careStatusWords(a.status)}</span>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>

          <fieldset>
            <legend className="text-xs font-medium text-ink-soft">Further lines</legend>
            <div className="mt-1.5 flex flex-wrap gap-x-5 gap-y-1.5">
              {careExtras.map((e) => (
                <label key={e.id} className="flex items-center gap-1.5 text-xs text-ink">
                  <input
                    type="checkbox"
                    className="accent-spruce-600"
                    checked={chosenExtras.includes(e.id)}
                    onChange={(ev) => setExtras(ev.target.checked ? [...chosenExtras, e.id] : chosenExtras.filter((x) => x !== e.id))}
                  />
                  {e[region]}
                </label>
              ))}
            </div>
          </fieldset>

          <ul className="space-y-1 text-xs leading-5 text-ink-soft">
            {advice.notes.map((n) => <li key={n} className="border-l-2 border-rule-strong pl-2">{n}</li>)}
          </ul>
        </div>
      </div>
    </Card>
  );
}
