'use client';

import { useEffect, useMemo, useRef } from 'react';
import { renderTile, repeatsForMinSize, yarnColourMap, type Colourway } from '@/lib/knit/render';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import { paintTileCanvas, useDevicePixelRatio } from './texture-tile';

export interface TextureSwatchProps {
  texture: Texture;
  yarns: readonly Yarn[];
  colourway?: Colourway;
  /** Hex colours by yarn id that win over the yarns' own. */
  yarnColours?: Readonly<Record<string, string>>;
  /** Side of the square, CSS px. Default 40. */
  size?: number;
  /** Wales shown across the square (a close-up, not true size). Default 8. */
  wales?: number;
  className?: string;
}

/**
 * A small square close-up of a texture for lists: the same loop rendering as the tile, scaled so
 * `wales` wales fill the square (courses at the texture's own proportion).
 */
export function TextureSwatch({ texture, yarns, colourway, yarnColours, size = 40, wales = 8, className }: TextureSwatchProps) {
  const drawing = useMemo(() => {
    const pxPerCm = (size * texture.density.walesPerCm) / wales;
    const { repeatsX, repeatsY } = repeatsForMinSize(texture, pxPerCm, size);
    const colours = { ...yarnColourMap(yarns, colourway), ...yarnColours };
    return renderTile(texture, colours, { repeatsX, repeatsY, pxPerCm, yarns });
  }, [texture, yarns, colourway, yarnColours, size, wales]);
  const dpr = useDevicePixelRatio();
  const ref = useRef<HTMLCanvasElement>(null);
  useEffect(() => {
    if (ref.current) paintTileCanvas(ref.current, drawing, dpr, size, size);
  }, [drawing, dpr, size]);
  return (
    <canvas
      ref={ref}
      className={className ?? 'rounded-[3px] border border-rule'}
      style={{ width: size, height: size }}
      role="img"
      aria-label={`${texture.name} swatch`}
    />
  );
}
