/** Every single-file export of a style by its name, as bytes with a type and a file name. */
import { HttpError } from '@/lib/api/errors';
import type { ExportKind, ExportQuery } from '@/lib/validations/mill';
import type { PackData } from './pack-data';
import { stitchMap, stitchMapLegendCsv, stitchMapLegendJson } from './stitch-map';
import { swatchSheetPdf } from './swatch-sheet';
import { tilePng } from './tile-png';
import { yarnListCsv } from './yarn-list';

export interface ExportFile {
  body: Uint8Array;
  contentType: string;
  fileName: string;
}

function slug(s: string): string {
  return s.normalize('NFKD').replace(/[^\w-]+/g, '-').replace(/-+/g, '-').replace(/^-|-$/g, '').toLowerCase() || 'x';
}

const text = (s: string) => new TextEncoder().encode(s);

/** @throws HttpError 400 naming the field when a texture or panel is missing or the tile too large. */
export function exportFile(data: PackData, kind: ExportKind, q: ExportQuery): ExportFile {
  const rev = data.release?.revision ?? data.style.revision;
  const base = `${slug(data.style.code)}-rev${rev}${data.release ? '' : '-working'}`;
  const need = (field: 'texture' | 'panel', v: string | undefined): string => {
    if (!v) throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { [field]: [`Choose a ${field}`] } });
    return v;
  };
  try {
    switch (kind) {
      case 'swatch-sheet.pdf':
        return { body: swatchSheetPdf(data, q.paper).bytes, contentType: 'application/pdf', fileName: `${base}-swatch-sheet-${q.paper}.pdf` };
      case 'tile.png': {
        const id = need('texture', q.texture);
        const t = tilePng(data, id, { pxPerCm: q.pxPerCm, ...(q.repeatsX ? { repeatsX: q.repeatsX } : {}), ...(q.repeatsY ? { repeatsY: q.repeatsY } : {}) });
        const name = data.textures.find((x) => x.id === id)?.name ?? id;
        return { body: t.png, contentType: 'image/png', fileName: `${base}-${slug(name)}-tile-${Math.round(q.pxPerCm)}ppcm.png` };
      }
      case 'stitch-map.png':
      case 'stitch-map.csv':
      case 'stitch-map.json': {
        const m = stitchMap(data, need('panel', q.panel));
        const panel = data.panels.find((p) => p.id === m.panelId)!;
        const stem = `${base}-${slug(panel.kind)}-stitch-map`;
        if (kind === 'stitch-map.png') return { body: m.png, contentType: 'image/png', fileName: `${stem}.png` };
        if (kind === 'stitch-map.csv') return { body: text(stitchMapLegendCsv(m)), contentType: 'text/csv; charset=utf-8', fileName: `${stem}-legend.csv` };
        return { body: text(stitchMapLegendJson(data, m)), contentType: 'application/json; charset=utf-8', fileName: `${stem}-legend.json` };
      }
      case 'yarn-list.csv':
        return { body: text(yarnListCsv(data)), contentType: 'text/csv; charset=utf-8', fileName: `${base}-yarn-list.csv` };
    }
  } catch (err) {
    if (err instanceof RangeError) {
      const field = /panel/i.test(err.message) ? 'panel' : kind === 'tile.png' ? 'texture' : '_';
      throw new HttpError(400, 'Some fields need attention.', { fieldErrors: { [field]: [err.message] } });
    }
    throw err;
  }
}
