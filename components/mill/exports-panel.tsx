'use client';

import { useState } from 'react';
import { Card } from '@/components/ui/card';
import { Field, Input, Select } from '@/components/ui/field';
import { PackBuilder } from './pack-builder';

export interface ExportChoices {
  styleId: string;
  /** The release printed; null for the working copy. */
  releaseId: string | null;
  title: string;
  textures: { id: string; name: string }[];
  panels: { id: string; name: string }[];
}

/** The downloads of one revision (or the working copy): swatch sheet, tiles, stitch maps, yarn list, mill pack. */
export function ExportsPanel({ choices }: { choices: ExportChoices }) {
  const [paper, setPaper] = useState<'a4' | 'letter'>('a4');
  const [texture, setTexture] = useState(choices.textures[0]?.id ?? '');
  const [pxPerCm, setPxPerCm] = useState('100');
  const [panel, setPanel] = useState(choices.panels[0]?.id ?? '');
  const base = `/api/styles/${choices.styleId}/exports`;
  const rel = choices.releaseId ? `release=${choices.releaseId}&` : '';
  const link = 'inline-flex h-9 items-center rounded-md border border-rule-strong bg-panel px-3 text-sm font-medium shadow-sm hover:bg-paper';
  return (
    <Card title={choices.title}>
      <div className="space-y-5">
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Paper" className="w-40">
            {(id) => (
              <Select id={id} value={paper} onChange={(e) => setPaper(e.target.value as 'a4' | 'letter')}>
                <option value="a4">A4</option>
                <option value="letter">US Letter</option>
              </Select>
            )}
          </Field>
          <a className={link} href={`${base}/swatch-sheet.pdf?${rel}paper=${paper}`}>Swatch sheet (PDF, true size)</a>
          <a className={link} href={`${base}/yarn-list.csv?${rel.replace(/&$/, '')}`}>Yarn list (CSV)</a>
        </div>
        <div>
          <h3 className="mb-2 text-xs font-semibold uppercase tracking-[0.06em] text-ink-faint">Mill pack</h3>
          <PackBuilder styleId={choices.styleId} releaseId={choices.releaseId} paper={paper} label="Build the mill pack (PDF)" />
        </div>
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Tile of texture" className="w-64">
            {(id) => (
              <Select id={id} value={texture} onChange={(e) => setTexture(e.target.value)}>
                {choices.textures.map((t) => <option key={t.id} value={t.id}>{t.name}</option>)}
              </Select>
            )}
          </Field>
          <Field label="px per cm" className="w-28" hint="20–400">
            {(id) => <Input id={id} inputMode="decimal" value={pxPerCm} onChange={(e) => setPxPerCm(e.target.value)} />}
          </Field>
          <a className={link} aria-disabled={!texture} href={`${base}/tile.png?${rel}texture=${encodeURIComponent(texture)}&pxPerCm=${encodeURIComponent(pxPerCm)}`}>Tile (PNG)</a>
        </div>
        <div className="flex flex-wrap items-end gap-3">
          <Field label="Stitch map of panel" className="w-64">
            {(id) => (
              <Select id={id} value={panel} onChange={(e) => setPanel(e.target.value)}>
                {choices.panels.map((p) => <option key={p.id} value={p.id}>{p.name}</option>)}
              </Select>
            )}
          </Field>
          <a className={link} href={`${base}/stitch-map.png?${rel}panel=${encodeURIComponent(panel)}`}>Stitch map (PNG)</a>
          <a className={link} href={`${base}/stitch-map.csv?${rel}panel=${encodeURIComponent(panel)}`}>Legend (CSV)</a>
          <a className={link} href={`${base}/stitch-map.json?${rel}panel=${encodeURIComponent(panel)}`}>Legend (JSON)</a>
        </div>
      </div>
    </Card>
  );
}
