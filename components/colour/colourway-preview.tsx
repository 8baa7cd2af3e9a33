'use client';

import { useId, useMemo } from 'react';
import { average, formatHex } from 'culori';
import { layoutPanels, zonesInDrawOrder, type TextureLookup } from '@/lib/editor';
import { faceYarnGrid } from '@/lib/knit/face';
import { yarnColourMap, yarnLookNotes, yarnLooks, type Colourway as RenderColourway, type YarnLook } from '@/lib/knit/render';
import type { Panel, StitchPolygon } from '@/lib/knit/panel';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';

const points = (poly: StitchPolygon) => poly.map((p) => `${p.x},${p.y}`).join(' ');
const gapCm = 4;

/**
 * The rectangles of a texture's face tile, in stitch units: one background rectangle in the most
 * common colour, then runs of the other colours along each course, merged with the same run in the
 * course above. Few, non-touching shapes of one colour keep the tile free of hairline seams.
 */
function faceRects(texture: Texture, colours: Readonly<Record<string, string>>) {
  const grid = faceYarnGrid(texture).map((row) => row.map((id) => colours[id] ?? '#cccccc'));
  const count = new Map<string, number>();
  for (const row of grid) for (const c of row) count.set(c, (count.get(c) ?? 0) + 1);
  const background = [...count.entries()].sort((p, q) => q[1] - p[1])[0]?.[0] ?? '#cccccc';
  const { needles, courses } = texture.repeat;
  const rects: { x: number; y: number; w: number; h: number; fill: string }[] = [{ x: 0, y: 0, w: needles, h: courses, fill: background }];
  const open = new Map<string, { x: number; y: number; w: number; h: number; fill: string }>();
  // Course 0 is knitted first and sits at the bottom of the repeat: draw from the top course down.
  for (let c = courses - 1; c >= 0; c--) {
    const row = grid[c] ?? [];
    const y = courses - 1 - c;
    const seen = new Set<string>();
    let start = 0;
    for (let n = 1; n <= row.length; n++) {
      const here = row[n - 1] ?? background;
      if (n < row.length && row[n] === here) continue;
      if (here !== background) {
        const key = `${start}:${n - start}:${here}`;
        const prev = open.get(key);
        if (prev && prev.y + prev.h === y) prev.h += 1;
        else {
          const r = { x: start, y, w: n - start, h: 1, fill: here };
          rects.push(r);
          open.set(key, r);
        }
        seen.add(key);
      }
      start = n;
    }
    for (const key of [...open.keys()]) if (!seen.has(key)) open.delete(key);
  }
  return rects;
}

function FaceTile({ id, texture, colours }: { id: string; texture: Texture; colours: Readonly<Record<string, string>> }) {
  return (
    <pattern id={id} patternUnits="userSpaceOnUse" width={texture.repeat.needles} height={texture.repeat.courses}>
      {faceRects(texture, colours).map((r, i) => <rect key={i} x={r.x} y={r.y} width={r.w} height={r.h} fill={r.fill} shapeRendering="crispEdges" />)}
    </pattern>
  );
}

/** The colour a texture reads as from a distance: the face yarns' colours mixed in linear light. */
function mixedColour(texture: Texture, colours: Readonly<Record<string, string>>): string {
  const [first, ...rest] = faceYarnGrid(texture).flat().map((id) => colours[id] ?? '#cccccc');
  if (first === undefined) return '#cccccc';
  return formatHex(average([first, ...rest], 'lrgb')) ?? '#cccccc';
}

/**
 * A small read-only view of the body map in a colourway: each panel at true relative size, its
 * zones filled with the yarn colours of their texture's face (as a repeat pattern where the repeat
 * is big enough to see, else the colour it reads as from a distance), clipped to the knitted area,
 * with the cut lines drawn over.
 */
export function ColourwayPreview({
  panels,
  textures,
  yarns,
  colourway,
  widthPx = 430,
}: {
  panels: readonly Panel[];
  textures: readonly Texture[];
  yarns: readonly Yarn[];
  colourway: RenderColourway | undefined;
  /** About how wide it is drawn, px (it scales to its box; this sets when repeats are drawn as patterns). */
  widthPx?: number;
}) {
  const uid = useId().replace(/:/g, '');
  const looks = useMemo(() => yarnLooks(yarns, colourway), [yarns, colourway]);
  const colours = useMemo(() => Object.fromEntries(Object.entries(looks).map(([id, l]) => [id, l.hex])), [looks]);
  const lookup: TextureLookup = useMemo(
    () =>
      Object.fromEntries(
        textures.map((t) => [t.id, { repeatNeedles: t.repeat.needles, repeatCourses: t.repeat.courses, walesPerCm: t.density.walesPerCm, coursesPerCm: t.density.coursesPerCm }]),
      ),
    [textures],
  );
  const layouts = useMemo(() => layoutPanels(panels, { pxPerCm: 1, pan: { x: 0, y: 0 } }, lookup, gapCm), [panels, lookup]);
  const textureById = useMemo(() => new Map(textures.map((t) => [t.id, t])), [textures]);
  const widthCm = layouts.reduce((m, l) => Math.max(m, l.leftCm + l.widthCm), 0);
  const heightCm = layouts.reduce((m, l) => Math.max(m, l.heightCm), 0);
  if (panels.length === 0 || widthCm <= 0 || heightCm <= 0) {
    return <p className="text-sm text-ink-soft">No panels to show yet: the body map is empty.</p>;
  }
  const pxPerCm = widthPx / (widthCm + 2);
  const used = [...new Set(panels.flatMap((p) => [p.baseTextureId, ...p.zones.map((z) => z.textureId)]))].filter((id) => textureById.has(id));

  const fillOf = (textureId: string) => {
    const t = textureById.get(textureId);
    if (!t) return '#d9d6ce';
    // A repeat narrower than about 3 screen px turns to noise: fill with the colour it reads as.
    const repeatPx = (t.repeat.needles / t.density.walesPerCm) * pxPerCm;
    return repeatPx >= 3 ? `url(#${uid}-t-${t.id})` : mixedColour(t, colours);
  };

  return (
    <div className="w-full">
    <svg
      role="img"
      aria-label={`Body map in this colourway: ${panels.map((p) => p.name).join(', ')}`}
      viewBox={`-1 -4 ${widthCm + 2} ${heightCm + 6}`}
      className="block h-auto w-full"
      data-testid="colourway-preview"
    >
      <defs>
        {used.map((id) => {
          const t = textureById.get(id);
          if (!t) return null;
          return (
            <FaceTile key={id} id={`${uid}-t-${id}`} texture={t} colours={colours} />
          );
        })}
        {panels.map((p) => (
          <clipPath key={p.id} id={`${uid}-k-${p.id}`}>
            <polygon points={points(p.knittedArea)} />
          </clipPath>
        ))}
      </defs>
      {panels.map((p) => {
        const l = layouts.find((x) => x.panelId === p.id);
        if (!l) return null;
        return (
          <g key={p.id}>
            <text x={l.leftCm + l.widthCm / 2} y={-1.4} textAnchor="middle" fontSize={2.4} fill="#4a5157" className="font-sans">
              {p.name}
            </text>
            <g transform={`translate(${l.leftCm} 0) scale(${1 / l.density.walesPerCm} ${1 / l.density.coursesPerCm})`}>
              <g clipPath={`url(#${uid}-k-${p.id})`}>
                <polygon points={points(p.knittedArea)} fill={fillOf(p.baseTextureId)} />
                {zonesInDrawOrder(p).map((z) => (
                  <polygon key={z.id} points={points(z.polygon)} fill={fillOf(z.textureId)} stroke="#ffffff" strokeOpacity={0.45} strokeWidth={0.75} vectorEffect="non-scaling-stroke">
                    <title>{`${z.name}: ${textureById.get(z.textureId)?.name ?? 'texture'}`}</title>
                  </polygon>
                ))}
              </g>
              <polygon points={points(p.knittedArea)} fill="none" stroke="#cbc6bb" strokeWidth={1.2} vectorEffect="non-scaling-stroke" />
              <polygon points={points(p.cutOutline)} fill="none" stroke="#1f2428" strokeWidth={1.1} strokeDasharray="4 2" vectorEffect="non-scaling-stroke" />
            </g>
          </g>
        );
      })}
    </svg>
    <LookMarks yarns={yarns} looks={looks} />
    </div>
  );
}

/** The yarns whose preview colour is not simply their target or their own colour, and why. */
function LookMarks({ yarns, looks }: { yarns: readonly Yarn[]; looks: Readonly<Record<string, YarnLook>> }) {
  const marked = yarns.flatMap((y) => {
    const l = looks[y.id];
    const text = l ? yarnLookNotes[l.source] : undefined;
    return l && text ? [{ yarn: y, look: l, text }] : [];
  });
  if (marked.length === 0) return null;
  return (
    <ul className="mt-2 space-y-1 text-2xs text-ink-soft" data-testid="preview-marks">
      {marked.map(({ yarn, look, text }) => (
        <li key={yarn.id} data-source={look.source} className="flex items-center gap-1.5">
          <span aria-hidden className="inline-block h-2.5 w-2.5 shrink-0 rounded-[2px] ring-1 ring-inset ring-black/15" style={{ backgroundColor: look.hex }} />
          <span><span className="font-medium text-ink">{yarn.name}</span>: {text}</span>
        </li>
      ))}
    </ul>
  );
}

/** One tile per texture the style uses: 3 × 1 cm of its face in the colourway's yarn colours. */
export function TextureFaceTiles({ textures, yarns, colourway }: { textures: readonly Texture[]; yarns: readonly Yarn[]; colourway: RenderColourway | undefined }) {
  const uid = useId().replace(/:/g, '');
  const colours = useMemo(() => yarnColourMap(yarns, colourway), [yarns, colourway]);
  return (
    <ul className="grid grid-cols-2 gap-2 sm:grid-cols-4">
      {textures.map((t) => {
        // 3 cm × 1 cm of fabric at the texture's relaxed density.
        const needles = Math.ceil(3 * t.density.walesPerCm);
        const courses = Math.ceil(t.density.coursesPerCm);
        return (
          <li key={t.id} className="min-w-0">
            <svg viewBox="0 0 3 1" preserveAspectRatio="xMidYMid slice" className="block aspect-[3/1] w-full rounded-[4px] ring-1 ring-inset ring-black/10" aria-hidden>
              <defs>
                <FaceTile id={`${uid}-f-${t.id}`} texture={t} colours={colours} />
              </defs>
              <g transform={`scale(${1 / t.density.walesPerCm} ${1 / t.density.coursesPerCm})`}>
                <rect width={needles} height={courses} fill={`url(#${uid}-f-${t.id})`} />
              </g>
            </svg>
            <div className="mt-1 truncate text-2xs text-ink-soft" title={t.name}>{t.name}</div>
          </li>
        );
      })}
    </ul>
  );
}
