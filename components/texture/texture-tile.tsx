'use client';

import { useEffect, useMemo, useRef, useSyncExternalStore } from 'react';
import {
  renderTile,
  repeatsForMinSize,
  yarnColourMap,
  type Colourway,
  type TileDrawing,
} from '@/lib/knit/render';
import { drawTile } from '@/lib/knit/render-canvas';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';

/** Colour sources for a texture: the yarns, an optional colourway, and hex overrides by yarn id. */
export interface TextureColourOptions {
  colourway?: Colourway;
  /** Hex colours by yarn id that win over the yarns' own (e.g. a colourway already resolved). */
  yarnColours?: Readonly<Record<string, string>>;
  /** Backdrop seen through open structures; `null` for transparent. Default: by the yarns. */
  background?: string | null;
}

function coloursFor(yarns: readonly Yarn[], opts: TextureColourOptions): Record<string, string> {
  return { ...yarnColourMap(yarns, opts.colourway), ...opts.yarnColours };
}

// ---------------------------------------------------------------------------------------------
// Device pixel ratio, as an external store so a tile redraws when the window moves to another screen.

function subscribeDpr(onChange: () => void): () => void {
  if (typeof window === 'undefined' || !window.matchMedia) return () => {};
  let mq = window.matchMedia(`(resolution: ${window.devicePixelRatio}dppx)`);
  const handler = () => {
    mq.removeEventListener('change', handler);
    mq = window.matchMedia(`(resolution: ${window.devicePixelRatio}dppx)`);
    mq.addEventListener('change', handler);
    onChange();
  };
  mq.addEventListener('change', handler);
  return () => mq.removeEventListener('change', handler);
}

/** The window's device pixel ratio (1 on the server), kept current. */
export function useDevicePixelRatio(): number {
  return useSyncExternalStore(
    subscribeDpr,
    () => window.devicePixelRatio || 1,
    () => 1,
  );
}

/**
 * Paint a drawing into a canvas at `dpr` backing px per CSS px, sizing the canvas's backing store to
 * `cssWidth × cssHeight` (the whole tile by default, stretched by under half a pixel to fill the
 * rounded canvas so it still repeats seamlessly; a smaller size crops the tile's top-left corner).
 */
export function paintTileCanvas(canvas: HTMLCanvasElement, drawing: TileDrawing, dpr: number, cssWidth = drawing.widthPx, cssHeight = drawing.heightPx): void {
  canvas.width = Math.max(1, Math.round(cssWidth * dpr));
  canvas.height = Math.max(1, Math.round(cssHeight * dpr));
  const ctx = canvas.getContext('2d');
  if (!ctx) return;
  ctx.clearRect(0, 0, canvas.width, canvas.height);
  // Whole tiles scale to the rounded canvas exactly; a crop (swatch) keeps the ratio.
  const sx = cssWidth === drawing.widthPx ? canvas.width / drawing.widthPx : dpr;
  const sy = cssHeight === drawing.heightPx ? canvas.height / drawing.heightPx : dpr;
  drawTile(ctx, drawing, { scaleX: sx, scaleY: sy });
}

// ---------------------------------------------------------------------------------------------
// The tile

export interface TextureTileProps extends TextureColourOptions {
  texture: Texture;
  yarns: readonly Yarn[];
  /** CSS px per cm of fabric. About 37.8 is true size on a nominal 96 dpi screen. */
  pxPerCm: number;
  /** Whole repeats across and up, or one number for both. Default 2. */
  repeats?: number | { x: number; y: number };
  className?: string;
}

/**
 * A texture's seamless tile drawn as knitted loops on a canvas, at `pxPerCm` CSS px per cm and
 * sharp at the screen's device pixel ratio.
 */
export function TextureTile({ texture, yarns, pxPerCm, repeats = 2, colourway, yarnColours, background, className }: TextureTileProps) {
  const rx = typeof repeats === 'number' ? repeats : repeats.x;
  const ry = typeof repeats === 'number' ? repeats : repeats.y;
  const drawing = useMemo(
    () =>
      renderTile(texture, coloursFor(yarns, { colourway, yarnColours }), {
        repeatsX: rx,
        repeatsY: ry,
        pxPerCm,
        yarns,
        ...(background !== undefined ? { background } : {}),
      }),
    [texture, yarns, colourway, yarnColours, background, rx, ry, pxPerCm],
  );
  const dpr = useDevicePixelRatio();
  const ref = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    if (ref.current) paintTileCanvas(ref.current, drawing, dpr);
  }, [drawing, dpr]);
  const size = `${(drawing.widthCm * 10).toFixed(1)} × ${(drawing.heightCm * 10).toFixed(1)} mm`;
  return (
    <canvas
      ref={ref}
      className={className}
      style={{ width: drawing.widthPx, height: drawing.heightPx }}
      role="img"
      aria-label={`${texture.name}: ${rx} × ${ry} repeats, ${size}`}
    />
  );
}

// ---------------------------------------------------------------------------------------------
// Patterns for Konva

export interface TexturePattern {
  /** The seamless tile, for Konva's `fillPatternImage` (cast: Konva's config type names images only). */
  image: HTMLCanvasElement;
  /** Whole repeats the image holds. */
  repeatsX: number;
  repeatsY: number;
  /** Image px per needle and per course, measured on the rounded image (use these for the scale). */
  pxPerNeedle: number;
  pxPerCourse: number;
  /** The tile's size in fabric, cm. */
  widthCm: number;
  heightCm: number;
}

export interface TexturePatternOptions extends TextureColourOptions {
  /**
   * Resolution of the image, px per cm of fabric: about the camera's px per cm × devicePixelRatio.
   * Rounded up to a step of √2 so zooming reuses images. Default: 10 px per needle.
   */
  pxPerCm?: number;
}

/** Largest side of a pattern image, px; finer requests are drawn coarser. */
const maxPatternPx = 2048;
/** Smallest side, px: tiny repeats are repeated up to it so rounding to whole px stays small. */
const minPatternPx = 96;
const patternCache = new Map<string, TexturePattern>();
const patternCacheSize = 64;

function quantizePxPerCm(pxPerCm: number): number {
  return Math.pow(2, Math.ceil(Math.log2(pxPerCm) * 2 - 1e-9) / 2);
}

/**
 * The pattern image of a texture: whole repeats (at least 96 px a side, at most 2048), drawn once per
 * texture content, colours and resolution and kept in a small cache. Browser only.
 */
export function texturePattern(texture: Texture, yarns: readonly Yarn[], options: TexturePatternOptions = {}): TexturePattern | null {
  if (typeof document === 'undefined') return null;
  const colours = coloursFor(yarns, options);
  const repeatW = texture.repeat.needles / texture.density.walesPerCm;
  const repeatH = texture.repeat.courses / texture.density.coursesPerCm;
  let pxPerCm = quantizePxPerCm(options.pxPerCm ?? 10 * texture.density.walesPerCm);
  pxPerCm = Math.min(pxPerCm, maxPatternPx / Math.max(repeatW, repeatH));
  const { repeatsX, repeatsY } = repeatsForMinSize(texture, pxPerCm, Math.min(minPatternPx, maxPatternPx));
  const used = new Set<string>();
  for (const f of texture.feeders) {
    used.add(f.ground);
    if (f.plated) used.add(f.plated.yarn);
  }
  const key = JSON.stringify([
    texture.id,
    texture.repeat.cells.map((row) => row.map((a) => a[0]).join('')),
    texture.feeders,
    texture.density,
    [...used].map((id) => [id, colours[id], yarns.find((y) => y.id === id)?.dtex]),
    options.background,
    pxPerCm,
    repeatsX,
    repeatsY,
  ]);
  const hit = patternCache.get(key);
  if (hit) {
    patternCache.delete(key);
    patternCache.set(key, hit);
    return hit;
  }
  const drawing = renderTile(texture, colours, {
    repeatsX,
    repeatsY,
    pxPerCm,
    yarns,
    ...(options.background !== undefined ? { background: options.background } : {}),
  });
  const image = document.createElement('canvas');
  paintTileCanvas(image, drawing, 1);
  const pattern: TexturePattern = {
    image,
    repeatsX,
    repeatsY,
    pxPerNeedle: image.width / drawing.needles,
    pxPerCourse: image.height / drawing.courses,
    widthCm: drawing.widthCm,
    heightCm: drawing.heightCm,
  };
  patternCache.set(key, pattern);
  if (patternCache.size > patternCacheSize) {
    const oldest = patternCache.keys().next().value;
    if (oldest !== undefined) patternCache.delete(oldest);
  }
  return pattern;
}

/**
 * The pattern image of a texture for filling Konva shapes (`fillPatternImage`), memoized per texture,
 * colours and resolution; null while rendering on the server or without a texture.
 *
 * For a shape drawn in stitch units (a group scaled by the camera's px per needle and per course):
 * `fillPatternScale = { x: 1 / pattern.pxPerNeedle, y: 1 / pattern.pxPerCourse }`; for a shape in
 * screen px, `patternScale(pattern, layout)` from `lib/knit/render`. Either way a needle of the
 * pattern lands on a needle of the panel, and the repeat's edges on the panel's needle 0 / course 0.
 *
 * @param options a resolution in px per cm (a number), or the options.
 */
export function useTexturePattern(
  texture: Texture | undefined,
  yarns: readonly Yarn[],
  options: number | TexturePatternOptions = {},
): TexturePattern | null {
  const o = typeof options === 'number' ? { pxPerCm: options } : options;
  const { pxPerCm, colourway, yarnColours, background } = o;
  return useMemo(
    () => {
      if (!texture) return null;
      const opts: TexturePatternOptions = {};
      if (pxPerCm !== undefined) opts.pxPerCm = pxPerCm;
      if (colourway) opts.colourway = colourway;
      if (yarnColours) opts.yarnColours = yarnColours;
      if (background !== undefined) opts.background = background;
      return texturePattern(texture, yarns, opts);
    },
    [texture, yarns, pxPerCm, colourway, yarnColours, background],
  );
}
