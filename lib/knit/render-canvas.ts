/**
 * Draws a texture drawing list (`renderTile`) onto a 2D canvas context: a browser canvas, an
 * OffscreenCanvas or a test double. Only the methods below are used, so no DOM types are needed.
 */
import type { DrawItem, Path, TileDrawing } from './render';

/** The part of `CanvasRenderingContext2D` the adapter uses. */
export interface Canvas2DLike {
  fillStyle: unknown;
  strokeStyle: unknown;
  lineWidth: number;
  lineCap: string;
  lineJoin: string;
  globalAlpha: number;
  save(): void;
  restore(): void;
  translate(x: number, y: number): void;
  scale(x: number, y: number): void;
  beginPath(): void;
  moveTo(x: number, y: number): void;
  lineTo(x: number, y: number): void;
  bezierCurveTo(cp1x: number, cp1y: number, cp2x: number, cp2y: number, x: number, y: number): void;
  closePath(): void;
  rect(x: number, y: number, w: number, h: number): void;
  clip(): void;
  fill(): void;
  stroke(): void;
}

export interface DrawTileOptions {
  /** Where the tile's top-left corner goes, context px. Default 0, 0. */
  x?: number;
  y?: number;
  /** Context px per tile px (e.g. devicePixelRatio, or canvas width ÷ tile width). Default 1. */
  scaleX?: number;
  scaleY?: number;
  /** Clip to the tile rectangle (default true): the edge stitches of the next repeats are cut off there. */
  clip?: boolean;
}

function trace(ctx: Canvas2DLike, path: Path, ox: number, oy: number): void {
  for (const cmd of path) {
    switch (cmd.op) {
      case 'moveTo':
        ctx.moveTo(cmd.x + ox, cmd.y + oy);
        break;
      case 'lineTo':
        ctx.lineTo(cmd.x + ox, cmd.y + oy);
        break;
      case 'bezierCurveTo':
        ctx.bezierCurveTo(cmd.cp1x + ox, cmd.cp1y + oy, cmd.cp2x + ox, cmd.cp2y + oy, cmd.x + ox, cmd.y + oy);
        break;
      case 'closePath':
        ctx.closePath();
        break;
    }
  }
}

/**
 * Paint a tile's drawing list onto `ctx`, every item's paint passes in order, strokes with round caps
 * and joins. The context's state is saved and restored around the call. Colour, width and alpha are
 * only set when they change (setting a colour is costly in browsers).
 */
export function drawTile(ctx: Canvas2DLike, drawing: TileDrawing, options: DrawTileOptions = {}): void {
  ctx.save();
  ctx.translate(options.x ?? 0, options.y ?? 0);
  ctx.scale(options.scaleX ?? 1, options.scaleY ?? 1);
  if (options.clip !== false) {
    ctx.beginPath();
    ctx.rect(0, 0, drawing.widthPx, drawing.heightPx);
    ctx.clip();
  }
  ctx.lineCap = 'round';
  ctx.lineJoin = 'round';
  let stroke: string | undefined;
  let fill: string | undefined;
  let width = -1;
  let alpha = 1;
  ctx.globalAlpha = 1;
  const paintItem = (item: DrawItem) => {
    for (const p of item.paints) {
      const a = p.alpha ?? 1;
      if (a !== alpha) ctx.globalAlpha = alpha = a;
      ctx.beginPath();
      trace(ctx, item.path, item.x + (p.dx ?? 0), item.y + (p.dy ?? 0));
      if (p.fill !== undefined) {
        if (p.fill !== fill) ctx.fillStyle = fill = p.fill;
        ctx.fill();
      }
      if (p.stroke !== undefined) {
        if (p.stroke !== stroke) ctx.strokeStyle = stroke = p.stroke;
        const wd = p.width ?? 1;
        if (wd !== width) ctx.lineWidth = width = wd;
        ctx.stroke();
      }
    }
  };
  for (const item of drawing.items) paintItem(item);
  ctx.restore();
}
