'use client';

import { useEffect, useRef, useState } from 'react';
import { Stage, Layer, Group, Line, Rect, Path, Text, Label, Tag } from 'react-konva';
import type Konva from 'konva';
import { fitCamera, layoutPanels, panelAtScreen, screenToStitch, zonesInDrawOrder, type TextureLookup } from '@/lib/editor';
import type { Panel, StitchPoint } from '@/lib/knit/panel';
import type { StitchBox } from '@/lib/rules/trim';

/** A trim as the drawing shows it. */
export interface CanvasTrim {
  id: string;
  panelId: string;
  box: StitchBox;
  label: string;
  /** The worst finding on it, if any. */
  tone: 'error' | 'warning' | 'info' | null;
  selected: boolean;
  /** A trim being added, not saved yet. */
  draft?: boolean;
}

export interface TrimCanvasProps {
  panels: readonly Panel[];
  textures: TextureLookup;
  colourOf: (textureId: string) => string;
  trims: readonly CanvasTrim[];
  editable: boolean;
  /** Clicking a panel places the selected trim there. */
  placing: boolean;
  onSelect: (id: string | null) => void;
  /** A trim dragged to a new box (whole needles and courses). */
  onMove: (id: string, box: StitchBox) => void;
  /** A click on a panel while placing: the stitch under the pointer. */
  onPlace: (panelId: string, at: StitchPoint) => void;
}

const GAP_CM = 6;
const INK = '#1f2428';
const SPRUCE = '#22665a';
const tones = { error: '#b8453c', warning: '#b7831f', info: '#4a5157' } as const;

const flat = (poly: readonly StitchPoint[]) => poly.flatMap((p) => [p.x, p.y]);
const pathOf = (poly: readonly StitchPoint[]) => poly.map((p, i) => `${i ? 'L' : 'M'}${p.x} ${p.y}`).join(' ') + ' Z';

/**
 * The style's panels drawn flat and read-only (zones in their textures' index colours, the cut
 * lines dashed, the cut-away part veiled) with the trims on them as boxes: click one to select
 * it, drag it to move it (it lands on whole needles and courses), click a panel to place.
 */
export default function TrimCanvas({ panels, textures, colourOf, trims, editable, placing, onSelect, onMove, onPlace }: TrimCanvasProps) {
  const box = useRef<HTMLDivElement>(null);
  const [size, setSize] = useState({ w: 800, h: 560 });
  useEffect(() => {
    const el = box.current;
    if (!el) return;
    const ro = new ResizeObserver(([entry]) => {
      if (!entry) return;
      setSize({ w: Math.max(240, Math.floor(entry.contentRect.width)), h: Math.max(240, Math.floor(entry.contentRect.height)) });
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  const camera = fitCamera(panels, textures, GAP_CM, { widthPx: size.w, heightPx: size.h - 24 }, 28);
  const layouts = layoutPanels(panels, { ...camera, pan: { x: camera.pan.x, y: camera.pan.y + 16 } }, textures, GAP_CM);

  const placeAt = (e: Konva.KonvaEventObject<MouseEvent | TouchEvent>) => {
    const pos = e.target.getStage()?.getPointerPosition();
    if (!pos) return;
    const layout = panelAtScreen(layouts, pos);
    if (placing && layout) {
      onPlace(layout.panelId, screenToStitch(layout, pos));
      return;
    }
    if (e.target === e.target.getStage() || e.target.name() === 'panel-ground') onSelect(null);
  };

  return (
    <div
      ref={box}
      className="absolute inset-0"
      style={{ cursor: placing ? 'crosshair' : 'default' }}
      data-testid="trim-canvas"
      data-panels={JSON.stringify(layouts.map((l) => ({ id: l.panelId, x: Math.round(l.origin.x), y: Math.round(l.origin.y), w: Math.round(l.widthPx), h: Math.round(l.heightPx), pxPerNeedle: l.pxPerNeedle, pxPerCourse: l.pxPerCourse })))}
    >
      <Stage width={size.w} height={size.h} onClick={placeAt} onTap={placeAt}>
        <Layer>
          {panels.map((panel) => {
            const layout = layouts.find((l) => l.panelId === panel.id);
            if (!layout) return null;
            const w = panel.widthNeedles;
            const h = panel.heightCourses;
            const sx = 1 / layout.pxPerNeedle;
            const sy = 1 / layout.pxPerCourse;
            return (
              <Group key={panel.id}>
                <Text x={layout.origin.x} y={layout.origin.y - 18} text={`${panel.name} · ${w} × ${h}`} fontSize={11} fontStyle="600" fill={INK} listening={false} />
                <Group x={layout.origin.x} y={layout.origin.y} scaleX={layout.pxPerNeedle} scaleY={layout.pxPerCourse}>
                  <Line
                    name="panel-ground"
                    points={flat(panel.knittedArea)}
                    closed
                    fill={panel.baseTextureId ? colourOf(panel.baseTextureId) : '#ece9e1'}
                    opacity={0.5}
                    stroke="#8d938f"
                    strokeWidth={1}
                    strokeScaleEnabled={false}
                  />
                  {zonesInDrawOrder(panel).map((z) => (
                    <Line key={z.id} points={flat(z.polygon)} closed fill={colourOf(z.textureId)} opacity={0.9} stroke={INK} strokeWidth={0.75} strokeScaleEnabled={false} listening={false} />
                  ))}
                  <Path data={`M0 0 L${w} 0 L${w} ${h} L0 ${h} Z ${pathOf(panel.cutOutline)}`} fillRule="evenodd" fill="rgba(246,245,241,0.72)" listening={false} />
                  <Line points={flat(panel.cutOutline)} closed stroke={SPRUCE} strokeWidth={1.4} dash={[6, 4]} strokeScaleEnabled={false} listening={false} />
                  {trims.filter((t) => t.panelId === panel.id).map((t) => {
                    const colour = t.tone ? tones[t.tone] : t.selected ? SPRUCE : INK;
                    return (
                      <Group
                        key={t.id}
                        x={t.box.x}
                        y={t.box.y}
                        draggable={editable}
                        onMouseDown={(e) => { e.cancelBubble = true; onSelect(t.id); }}
                        onTap={(e) => { e.cancelBubble = true; onSelect(t.id); }}
                        onClick={(e) => { e.cancelBubble = true; }}
                        onDragMove={(e) => {
                          const n = e.target;
                          n.x(Math.min(Math.max(0, Math.round(n.x())), Math.max(0, w - t.box.width)));
                          n.y(Math.min(Math.max(0, Math.round(n.y())), Math.max(0, h - t.box.height)));
                        }}
                        onDragEnd={(e) => onMove(t.id, { ...t.box, x: Math.round(e.target.x()), y: Math.round(e.target.y()) })}
                        onMouseEnter={(e) => { const s = e.target.getStage(); if (s && editable) s.container().style.cursor = 'move'; }}
                        onMouseLeave={(e) => { const s = e.target.getStage(); if (s) s.container().style.cursor = placing ? 'crosshair' : 'default'; }}
                      >
                        <Rect
                          width={t.box.width}
                          height={t.box.height}
                          fill={t.selected ? 'rgba(255,255,255,0.82)' : 'rgba(255,255,255,0.62)'}
                          stroke={colour}
                          strokeWidth={t.selected ? 2.25 : 1.5}
                          dash={t.draft ? [4, 3] : undefined}
                          strokeScaleEnabled={false}
                        />
                        {t.label ? (
                          <Label y={-17 * sy} scaleX={sx} scaleY={sy} listening={false}>
                            <Tag fill="rgba(255,255,255,0.88)" cornerRadius={2} />
                            <Text text={t.label} fontSize={11} padding={2} fontStyle={t.selected ? '600' : 'normal'} fill={colour} />
                          </Label>
                        ) : null}
                      </Group>
                    );
                  })}
                </Group>
              </Group>
            );
          })}
        </Layer>
      </Stage>
    </div>
  );
}
