/**
 * The tile PNG: one texture's seamless tile (whole repeats) rasterised from the renderer's drawing
 * list at a chosen px per cm, its physical size in the file's pHYs chunk.
 *
 * A PNG has whole pixels, so the tile is rounded to whole px and each axis keeps its own exact
 * scale (px ÷ the tile's cm); the pHYs chunk carries those two scales, so px ÷ pxPerMetre is the
 * tile's true width and height within half a pixel.
 */
import { renderTile, repeatsForMinSize, yarnLookNotes } from '@/lib/knit/render';
import { textureYarnIds } from '@/lib/knit/texture';
import { BitmapContext } from '@/lib/knit/render-bitmap';
import { drawTile } from '@/lib/knit/render-canvas';
import { encodePng } from './png';
import { packYarnLooks, type PackData } from './pack-data';

export const tileLimits = { minPxPerCm: 20, maxPxPerCm: 400, maxSidePx: 2400, maxRepeats: 200 } as const;

export interface TilePng {
  png: Buffer;
  widthPx: number;
  heightPx: number;
  widthCm: number;
  heightCm: number;
  repeatsX: number;
  repeatsY: number;
  pxPerCmX: number;
  pxPerCmY: number;
}

/**
 * Renders the texture's tile. Without repeats, the fewest whole repeats that make it at least
 * 256 px a side. @throws RangeError when the tile would be larger than `tileLimits.maxSidePx`.
 */
export function tilePng(data: PackData, textureId: string, opts: { pxPerCm: number; repeatsX?: number; repeatsY?: number }): TilePng {
  const texture = data.textures.find((t) => t.id === textureId);
  if (!texture) throw new RangeError('That texture is not part of this style.');
  const { pxPerCm } = opts;
  const fit = repeatsForMinSize(texture, pxPerCm, 256);
  const repeatsX = opts.repeatsX ?? fit.repeatsX;
  const repeatsY = opts.repeatsY ?? fit.repeatsY;
  const looks = packYarnLooks(data);
  const colours = Object.fromEntries(Object.entries(looks).map(([id, l]) => [id, l.hex]));
  const drawing = renderTile(texture, colours, { repeatsX, repeatsY, pxPerCm });
  // The legend lines of the colourway preview, for the yarns of this texture it marks.
  const marks = textureYarnIds(texture).flatMap((id) => {
    const l = looks[id];
    const note = l ? yarnLookNotes[l.source] : undefined;
    return note ? [`${data.yarns.find((y) => y.id === id)?.name ?? id}: ${note}`] : [];
  });
  const widthPx = Math.max(1, Math.round(drawing.widthPx));
  const heightPx = Math.max(1, Math.round(drawing.heightPx));
  if (widthPx > tileLimits.maxSidePx || heightPx > tileLimits.maxSidePx) {
    throw new RangeError(`That tile would be ${widthPx} × ${heightPx} px; at most ${tileLimits.maxSidePx} px a side. Choose fewer repeats or px per cm.`);
  }
  const ctx = new BitmapContext(widthPx, heightPx);
  drawTile(ctx, drawing, { scaleX: widthPx / drawing.widthPx, scaleY: heightPx / drawing.heightPx });
  const pxPerCmX = widthPx / drawing.widthCm;
  const pxPerCmY = heightPx / drawing.heightCm;
  const png = encodePng(ctx.data, widthPx, heightPx, {
    pxPerMetre: { x: pxPerCmX * 100, y: pxPerCmY * 100 },
    text: {
      Title: `${data.style.code} ${texture.name}`.replace(/[^\x20-\x7e]/g, '?'),
      Comment: [
        `${repeatsX} x ${repeatsY} repeats, ${drawing.needles} needles x ${drawing.courses} courses, ${(drawing.widthCm * 10).toFixed(2)} x ${(drawing.heightCm * 10).toFixed(2)} mm relaxed`,
        ...marks,
      ].join('. ').replace(/[^\x20-\x7e]/g, '?'),
    },
  });
  return { png, widthPx, heightPx, widthCm: drawing.widthCm, heightCm: drawing.heightCm, repeatsX, repeatsY, pxPerCmX, pxPerCmY };
}
