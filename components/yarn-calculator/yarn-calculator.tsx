'use client';

import { useMemo, useState } from 'react';
import Link from 'next/link';
import type { YarnCalculatorSource } from '@/lib/db/yarn-calculator';
import type { ContentMethod } from '@/lib/knit/content';
import type { BodyMapSummary } from '@/lib/knit/summary';
import type { Panel } from '@/lib/knit/panel';
import { yarnCalculator, defaultWasteAllowance } from '@/lib/knit/yarn-calculator';
import { contentMethodLabels, contentMethods, maxGarmentsPerSize, maxWastePct, yarnCalculatorQueryString } from '@/lib/validations/yarn-calculator';
import { Card, Notice } from '@/components/ui/card';
import { Input } from '@/components/ui/field';
import { TextureTables } from './texture-tables';
import { SizeTable } from './size-table';
import { OrderCard } from './order-card';
import { ContentLabels } from './content-labels';
import { CareLabel } from './care-label';

/** The rasters of the last calculation per set of panels: they do not change with the options. */
const lastRasters = new WeakMap<readonly Panel[], BodyMapSummary['rasters']>();

/** Default garments per size for a first run: a small sample order, editable. */
function defaultRun(sizes: readonly string[], base: string): Record<string, number> {
  return Object.fromEntries(sizes.map((s) => [s, s === base ? 50 : 25]));
}

function Segmented<T extends string>({ label, value, options, onChange }: { label: string; value: T; options: readonly { value: T; label: string }[]; onChange: (v: T) => void }) {
  return (
    <div className="flex overflow-hidden rounded-md border border-rule-strong text-xs" role="group" aria-label={label}>
      {options.map((o) => (
        <button
          key={o.value}
          type="button"
          aria-pressed={value === o.value}
          onClick={() => onChange(o.value)}
          className={`px-2.5 py-1.5 font-medium ${value === o.value ? 'bg-spruce-600 text-white' : 'bg-panel text-ink-soft hover:text-ink'}`}
        >
          {o.label}
        </button>
      ))}
    </div>
  );
}

/**
 * The yarn calculator of a style, computed in the browser from the saved body map with the same
 * lib functions the API uses: per texture, per size, the run's order, the fibre-content labels and
 * the care-label draft. Options (waste allowance, method, garments) change the figures at once.
 */
export function YarnCalculator({ source }: { source: YarnCalculatorSource }) {
  const { style } = source;
  const [wasteText, setWasteText] = useState(String(defaultWasteAllowance * 100));
  const [method, setMethod] = useState<ContentMethod>('nominal');
  const [garments, setGarments] = useState<Record<string, number>>(() => defaultRun(style.sizes, style.baseSize));

  const wastePct = Number(wasteText.replace(',', '.'));
  const wasteError = wasteText.trim() === '' || !Number.isFinite(wastePct) ? 'Enter a number' : wastePct < 0 || wastePct > maxWastePct ? `Between 0 and ${maxWastePct} %` : null;
  const waste = wasteError ? defaultWasteAllowance * 100 : wastePct;

  const textures = useMemo(() => new Map(source.textures.map((t) => [t.id, t])), [source.textures]);
  const prices = useMemo(() => {
    if (!source.showPrices) return undefined;
    const out: Record<string, number> = {};
    for (const y of source.yarns) if (y.pricePerKg !== null) out[y.id] = y.pricePerKg;
    return out;
  }, [source.showPrices, source.yarns]);

  const result = useMemo(() => {
    const rasters = lastRasters.get(source.panels);
    const r = yarnCalculator({
      panels: source.panels,
      textures,
      yarns: source.yarns,
      gauge: style.gauge,
      garment: style.garmentType,
      sizes: style.sizes,
      baseSize: style.baseSize,
      graded: source.graded,
      wasteAllowance: waste / 100,
      method,
      garments,
      heatTransfer: source.heatTransfer,
      ...(prices ? { pricesPerKg: prices } : {}),
      ...(rasters ? { previous: { panels: source.panels, rasters } } : {}),
    });
    lastRasters.set(source.panels, r.summary.rasters);
    return r;
  }, [source, textures, style, waste, method, garments, prices]);
  const { figures } = result;

  const yarnName = (id: string) => source.yarns.find((y) => y.id === id)?.name ?? 'Unknown yarn';
  const csvHref = `/api/styles/${style.id}/yarn-order.csv?${yarnCalculatorQueryString({ wastePct: waste, method, garments })}`;

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-end gap-x-6 gap-y-3 rounded-[var(--radius-card)] border border-rule bg-panel px-4 py-3">
        <div>
          <label htmlFor="waste" className="block text-xs font-medium text-ink-soft">Waste allowance</label>
          <div className="mt-1 flex items-center gap-1.5">
            <Input
              id="waste"
              inputMode="decimal"
              className="figures w-20 text-right"
              value={wasteText}
              aria-invalid={wasteError ? true : undefined}
              onChange={(e) => setWasteText(e.target.value)}
            />
            <span className="text-sm text-ink-soft">% on knitted yarn</span>
          </div>
          <p className={`mt-1 text-[11px] ${wasteError ? 'text-madder-700' : 'text-ink-faint'}`}>{wasteError ?? '5 % is common practice; set your mill’s figure.'}</p>
        </div>
        <div>
          <span className="block text-xs font-medium text-ink-soft">Content method</span>
          <div className="mt-1">
            <Segmented label="Content method" value={method} onChange={setMethod} options={contentMethods.map((m) => ({ value: m, label: contentMethodLabels[m] }))} />
          </div>
          <p className="mt-1 text-[11px] text-ink-faint">{method === 'nominal' ? 'Yarn masses as bought.' : 'Clean dry mass plus the agreed allowances (Reg. (EU) 1007/2011 Annex IX).'}</p>
        </div>
        <div className="ml-auto text-right text-xs leading-5 text-ink-soft">
          <div>Base size <span className="figures font-semibold text-ink">{style.baseSize}</span> · <span className="figures">{style.gauge}</span> gauge</div>
          <div>{source.generated ? 'From generated panels: no body map saved yet' : 'From the saved body map'} · <Link href={`/styles/${style.id}/body-map`} className="text-spruce-700 underline">open it</Link></div>
        </div>
      </div>

      {source.generated ? (
        <Notice tone="warn">No body map is saved for this style yet: the figures are for the panels generated from the garment type, all in the base texture. Draw the zones in the body map to see the real figures.</Notice>
      ) : null}
      {figures.problems.length > 0 ? <Notice tone="error">{figures.problems.join(' ')}</Notice> : null}
      {source.notes.map((n) => <Notice key={n} tone="warn">{n}</Notice>)}

      <TextureTables figures={figures} textures={textures} yarns={source.yarns} />

      <Card title="Yarn per garment, by size" actions={<span className="text-xs text-ink-faint">grams · knitted yarn + {waste} % waste allowance</span>}>
        <SizeTable figures={figures} yarnName={yarnName} showCost={!!prices} />
        <p className={`mt-3 text-xs leading-5 ${figures.grading.mode === 'graded' ? 'text-ink-soft' : 'text-ochre-700'}`} data-testid="grading-note">{figures.grading.explanation}</p>
      </Card>

      <OrderCard
        figures={figures}
        sizes={style.sizes}
        garments={garments}
        onGarments={(size, n) => setGarments((g) => ({ ...g, [size]: Math.min(maxGarmentsPerSize, Math.max(0, n)) }))}
        yarnName={yarnName}
        {...(prices ? { pricesPerKg: prices } : {})}
        csvHref={csvHref}
      />

      <ContentLabels figures={figures} method={method} />

      <CareLabel styleId={style.id} figures={figures} sizes={style.sizes} baseSize={style.baseSize} />
    </div>
  );
}
