/**
 * The stitch map: a panel at one pixel per stitch (x = needle from the left, y = course from the
 * top of the panel, as the body map draws it), each texture in its own index colour, for the mill's
 * programmers to read into their own tools; with a legend (CSV or JSON) from colour to texture.
 */
import { rasterizePanel } from '@/lib/knit/raster';
import { parseHexColour } from '@/lib/knit/render-bitmap';
import { csv } from './csv';
import { encodePng } from './png';
import { packTextureColours, type PackData } from './pack-data';

/** Stitches that are not knitted (outside the knitted area). */
export const notKnittedHex = '#ffffff';

export interface StitchMapLegendEntry {
  /** Index in the map (0 = not knitted). */
  index: number;
  hex: string;
  rgb: [number, number, number];
  textureId: string | null;
  textureName: string;
  repeat: string | null;
  walesPerCm: number | null;
  coursesPerCm: number | null;
  /** Knitted stitches inside and outside the cut outline. */
  inside: number;
  outside: number;
}

export interface StitchMap {
  panelId: string;
  panelName: string;
  widthNeedles: number;
  heightCourses: number;
  png: Buffer;
  legend: StitchMapLegendEntry[];
  /** Row-major texture index of every stitch (0 = not knitted), as in the PNG. */
  cells: Uint16Array;
}

export function stitchMap(data: PackData, panelId: string): StitchMap {
  const panel = data.panels.find((p) => p.id === panelId || p.kind === panelId);
  if (!panel) throw new RangeError('That panel is not part of this style.');
  const raster = rasterizePanel(panel);
  const colours = packTextureColours(data);
  const byId = new Map(data.textures.map((t) => [t.id, t]));
  const legend: StitchMapLegendEntry[] = raster.legend.map((id, index) => {
    const t = id ? byId.get(id) : undefined;
    const hex = index === 0 ? notKnittedHex : (colours[id] ?? '#999999');
    const count = raster.stitches[id] ?? { inside: 0, outside: 0 };
    return {
      index,
      hex,
      rgb: parseHexColour(hex),
      textureId: id || null,
      textureName: index === 0 ? 'not knitted' : (t?.name ?? `unknown texture ${id}`),
      repeat: t ? `${t.repeat.needles}x${t.repeat.courses}` : null,
      walesPerCm: t?.density.walesPerCm ?? null,
      coursesPerCm: t?.density.coursesPerCm ?? null,
      inside: index === 0 ? 0 : count.inside,
      outside: index === 0 ? 0 : count.outside,
    };
  });
  const { width, height, cells } = raster;
  const rgba = new Uint8Array(width * height * 4);
  for (let i = 0; i < cells.length; i++) {
    const e = legend[cells[i]!] ?? legend[0]!;
    rgba[i * 4] = e.rgb[0];
    rgba[i * 4 + 1] = e.rgb[1];
    rgba[i * 4 + 2] = e.rgb[2];
    rgba[i * 4 + 3] = 255;
  }
  const png = encodePng(rgba, width, height, {
    text: { Title: `${data.style.code} ${panel.kind} stitch map`, Comment: 'One pixel per stitch: x = needle, y = course from the top. See the legend.' },
  });
  return { panelId: panel.id, panelName: panel.name, widthNeedles: width, heightCourses: height, png, legend, cells };
}

export function stitchMapLegendCsv(map: StitchMap): string {
  return csv([
    ['index', 'hex', 'r', 'g', 'b', 'texture_id', 'texture', 'repeat_needles_x_courses', 'wales_per_cm', 'courses_per_cm', 'stitches_inside_cut', 'stitches_outside_cut'],
    ...map.legend.map((e) => [e.index, e.hex, e.rgb[0], e.rgb[1], e.rgb[2], e.textureId, e.textureName, e.repeat, e.walesPerCm, e.coursesPerCm, e.inside, e.outside]),
  ]);
}

export function stitchMapLegendJson(data: PackData, map: StitchMap): string {
  const panel = data.panels.find((p) => p.id === map.panelId)!;
  return JSON.stringify(
    {
      style: data.style.code,
      revision: data.release?.revision ?? data.style.revision,
      panel: { id: panel.id, kind: panel.kind, name: panel.name, widthNeedles: map.widthNeedles, heightCourses: map.heightCourses },
      axes: 'x = needle from the left edge (0-based), y = course from the top edge (0-based); one pixel per stitch',
      legend: map.legend,
      knittedArea: panel.knittedArea,
      cutOutline: panel.cutOutline,
    },
    null,
    2,
  );
}
