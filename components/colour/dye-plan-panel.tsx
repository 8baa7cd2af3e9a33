import type { ColourwayPlan } from '@/lib/colour/colourway';
import type { DyeFinding, DyeFindingKind } from '@/lib/colour/dye-plan';
import { fibres } from '@/lib/knit/fibres';
import type { ColourwayTarget, StyleYarn } from '@/lib/db/colourways';
import { Swatch } from './swatch';

const kindLabels: Record<DyeFindingKind, string> = {
  clash: 'Dye clash',
  'stain-risk': 'Stain risk',
  'heat-limit': 'Heat limit',
  undyeable: 'Takes no dye',
  'low-contrast': 'Low contrast',
  'grin-through': 'Grin-through',
};

const severityStyle: Record<DyeFinding['severity'], { dot: string; label: string; row: string }> = {
  error: { dot: 'bg-madder-500', label: 'Must change', row: 'border-madder-500/30 bg-madder-50/60' },
  warning: { dot: 'bg-ochre-500', label: 'Check', row: 'border-ochre-500/25 bg-ochre-50/60' },
  info: { dot: 'bg-spruce-500', label: 'Note', row: 'border-spruce-100 bg-spruce-50/60' },
};

const durationLabels = { short: 'short', standard: 'standard', long: 'long' } as const;

const dyeClassLabel = (c: string) => `${c.charAt(0).toUpperCase()}${c.slice(1)}`;

/** The baths in the order they run, then the findings with what to do instead. */
export function DyePlanPanel({ plan, targets, yarns }: { plan: ColourwayPlan; targets: readonly ColourwayTarget[]; yarns: readonly StyleYarn[] }) {
  const yarnName = (id: string) => yarns.find((y) => y.id === id)?.name ?? 'a yarn no longer in the style';
  const findings = [...plan.findings].sort((p, q) => order(p.severity) - order(q.severity));
  return (
    <div className="space-y-5">
      <section aria-label="Baths">
        <h3 className="mb-2 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">Baths, in the order they run</h3>
        {plan.baths.length === 0 ? (
          <p className="text-sm text-ink-soft">No baths: nothing in this colourway is dyed {targets.length ? 'in a bath' : 'yet — add a target'}.</p>
        ) : (
          <ol className="divide-y divide-rule rounded-md border border-rule">
            {plan.baths.map((b) => {
              const target = targets.find((t) => t.id === b.targetId);
              return (
                <li key={`${b.stage}-${b.order}`} className="grid grid-cols-[2rem_auto_1fr_auto] items-center gap-3 px-3 py-2.5 text-sm">
                  <span className="figures text-center text-base font-semibold text-ink-faint">{b.order}</span>
                  {target ? <Swatch lab={target.colour} size="sm" label={target.name} /> : <span />}
                  <div className="min-w-0">
                    <div className="font-medium">
                      {dyeClassLabel(b.dyeClass)} dyes → {target?.name ?? 'target'}
                      <span className="ml-2 rounded bg-rule/60 px-1.5 py-px text-2xs font-medium text-ink-soft">
                        {b.stage === 'yarn' ? 'on the yarn, before knitting' : 'on the garment'}
                      </span>
                    </div>
                    <div className="truncate text-xs text-ink-soft">
                      Colours {b.fibres.map((f) => fibres[f].names.eu).join(', ')} in {b.yarnIds.map(yarnName).join(', ')}
                    </div>
                  </div>
                  <div className="text-right text-xs text-ink-soft">
                    <div className="figures text-sm font-medium text-ink">{b.temperatureC} °C</div>
                    <div>{durationLabels[b.durationClass]} bath</div>
                  </div>
                </li>
              );
            })}
          </ol>
        )}
      </section>
      <section aria-label="Findings">
        <h3 className="mb-2 text-xs font-semibold uppercase tracking-[0.08em] text-ink-faint">
          Findings <span className="figures font-normal normal-case tracking-normal">({findings.length})</span>
        </h3>
        {findings.length === 0 ? (
          <p className="text-sm text-ink-soft">Nothing to change: the fibres can take these colours in these baths.</p>
        ) : (
          <ul className="space-y-2" data-testid="dye-findings">
            {findings.map((f, i) => {
              const s = severityStyle[f.severity];
              return (
                <li key={i} className={`rounded-md border px-3 py-2 text-sm ${s.row}`} data-kind={f.kind}>
                  <div className="mb-0.5 flex items-center gap-2 text-xs font-semibold">
                    <span aria-hidden className={`h-2 w-2 rounded-full ${s.dot}`} />
                    <span>{kindLabels[f.kind]}</span>
                    <span className="font-normal text-ink-faint">· {s.label}</span>
                  </div>
                  <p className="text-ink">{f.message}</p>
                  <p className="mt-1 text-ink-soft"><span className="font-medium text-ink">Instead: </span>{f.instead}</p>
                </li>
              );
            })}
          </ul>
        )}
      </section>
    </div>
  );
}

function order(s: DyeFinding['severity']): number {
  return s === 'error' ? 0 : s === 'warning' ? 1 : 2;
}
