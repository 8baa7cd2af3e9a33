/**
 * The yarn list (CSV): every yarn the style's textures feed, its count, make-up and colour, the
 * textures it feeds, and grams per garment per size (knitted, waste included, and with the waste
 * allowance) from the body map.
 */
import { csv } from './csv';
import {
  consumptionPerSize, packSummary, textureFacts, yarnColourText, yarnCountText, yarnFibreText, type PackData,
} from './pack-data';

export function yarnListCsv(data: PackData): string {
  const summary = packSummary(data);
  const sizes = consumptionPerSize(data, summary);
  const facts = textureFacts(data);
  const header = [
    'yarn', 'supplier_ref', 'count', 'dtex', 'filaments', 'lustre', 'fibres', 'colour', 'textures',
    ...sizes.flatMap((s) => [`${s.size}_knitted_g`, `${s.size}_gross_g`]),
  ];
  const rows = data.yarns.map((y) => {
    const usedBy = facts.filter((f) => f.feeders.some((l) => l.ground.id === y.id || l.plated?.id === y.id)).map((f) => f.texture.name);
    return [
      y.name, y.supplierRef, yarnCountText(y), y.dtex, y.filaments ?? null, y.lustre, yarnFibreText(y.fibres), yarnColourText(y.colour),
      usedBy.join('; '),
      ...sizes.flatMap((s) => {
        const c = s.yarns[y.id];
        return c ? [Number(c.knittedGrams.toFixed(2)), Number(c.grossGrams.toFixed(2))] : [null, null];
      }),
    ];
  });
  return csv([header, ...rows]);
}
