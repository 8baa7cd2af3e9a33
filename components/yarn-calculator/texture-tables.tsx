'use client';

import type { LibraryTexture } from '@/lib/db/textures';
import type { LibraryYarn } from '@/lib/db/yarns';
import { textureYarnIds } from '@/lib/knit/texture';
import type { YarnCalculatorFigures } from '@/lib/knit/yarn-calculator';
import { Card } from '@/components/ui/card';
import { TextureSwatch } from '@/components/texture/texture-swatch';
import { grams, num } from './format';

const head = 'px-2 py-1.5 text-[11px] font-medium uppercase tracking-[0.06em] text-ink-faint';
const th = `${head} text-right`;

/**
 * Per texture used on the body map: stitches kept inside the cut lines and cut away outside them,
 * the kept area, and each yarn's metres and grams over all the texture's knitted stitches.
 */
export function TextureTables({ figures, textures, yarns }: {
  figures: YarnCalculatorFigures; textures: ReadonlyMap<string, LibraryTexture>; yarns: readonly LibraryYarn[];
}) {
  const yarnName = (id: string) => yarns.find((y) => y.id === id)?.name ?? 'Unknown yarn';
  const totals = new Map<string, { metres: number; grams: number }>();
  for (const t of figures.textures) {
    for (const y of t.yarns) {
      const s = totals.get(y.yarnId) ?? { metres: 0, grams: 0 };
      s.metres += y.metres;
      s.grams += y.grams;
      totals.set(y.yarnId, s);
    }
  }
  const stitchTotal = figures.textures.reduce((s, t) => s + t.inside + t.outside, 0);
  return (
    <Card title={`Per texture · size ${figures.baseSize} as drawn`} actions={<span className="text-xs text-ink-faint">metres and grams over every knitted stitch, cut-away waste included</span>} className="[&>div]:p-0">
      <table className="w-full text-sm" data-testid="texture-yarns">
        <thead className="border-b border-rule bg-paper/60">
          <tr>
            <th className={`${head} pl-4 text-left`}>Texture</th>
            <th className={th}>Kept stitches</th>
            <th className={th}>Cut away</th>
            <th className={th}>Kept area</th>
            <th className={`${head} pl-6 text-left`}>Yarn</th>
            <th className={th}>Metres</th>
            <th className={`${th} pr-4`}>Grams</th>
          </tr>
        </thead>
        {figures.textures.map((t) => {
          const texture = textures.get(t.textureId);
          const rows = t.yarns.length ? t.yarns : [null];
          const own = texture ? yarns.filter((y) => textureYarnIds(texture).includes(y.id)) : [];
          return (
            <tbody key={t.textureId} className="border-b border-rule last:border-0">
              {rows.map((y, i) => (
                <tr key={y?.yarnId ?? 'none'} className={i > 0 ? 'border-t border-rule/50' : ''}>
                  {i === 0 ? (
                    <>
                      <td rowSpan={rows.length} className="px-2 py-2 pl-4 align-top">
                        <div className="flex items-center gap-2.5">
                          {texture ? <TextureSwatch texture={texture} yarns={own} size={32} /> : null}
                          <span className="font-medium">{texture?.name ?? 'Unknown texture'}</span>
                        </div>
                      </td>
                      <td rowSpan={rows.length} className="figures px-2 py-2 text-right align-top">{num(t.inside)}</td>
                      <td rowSpan={rows.length} className="figures px-2 py-2 text-right align-top text-ink-soft">{num(t.outside)}</td>
                      <td rowSpan={rows.length} className="figures px-2 py-2 text-right align-top">{num(t.insideCm2 / 100, 1)} dm²</td>
                    </>
                  ) : null}
                  <td className="px-2 py-1.5 pl-6 text-ink-soft">{y ? yarnName(y.yarnId) : '—'}</td>
                  <td className="figures px-2 py-1.5 text-right">{y ? num(y.metres) : '—'}</td>
                  <td className="figures px-2 py-1.5 pr-4 text-right">{y ? grams(y.grams) : '—'}</td>
                </tr>
              ))}
            </tbody>
          );
        })}
        <tfoot className="border-t border-rule-strong bg-paper/60">
          {[...totals.entries()].map(([id, s], i) => (
            <tr key={id} className={i > 0 ? 'border-t border-rule/50' : ''}>
              {i === 0 ? (
                <>
                  <td rowSpan={totals.size} className="px-2 py-2 pl-4 align-top font-semibold">All textures</td>
                  <td colSpan={2} rowSpan={totals.size} className="figures px-2 py-2 text-right align-top text-ink-soft">{num(stitchTotal)} knitted</td>
                  <td rowSpan={totals.size} />
                </>
              ) : null}
              <td className="px-2 py-1.5 pl-6 font-medium">{yarnName(id)}</td>
              <td className="figures px-2 py-1.5 text-right font-medium">{num(s.metres)}</td>
              <td className="figures px-2 py-1.5 pr-4 text-right font-semibold">{grams(s.grams)}</td>
            </tr>
          ))}
        </tfoot>
      </table>
    </Card>
  );
}
