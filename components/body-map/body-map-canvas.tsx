'use client';

import { memo, useEffect, useRef, useState } from 'react';
import { Stage, Layer, Group, Line, Rect, Path, Text, Circle } from 'react-konva';
import type Konva from 'konva';
import type { Editor, EditorState, PanelLayout } from '@/lib/editor';
import { zonesInDrawOrder } from '@/lib/editor';
import type { Panel, StitchPoint, Zone } from '@/lib/knit/panel';
import type { Texture } from '@/lib/knit/texture';
import type { Yarn } from '@/lib/knit/yarn';
import type { StitchBox } from '@/lib/rules/trim';
import { useTexturePattern } from '@/components/texture/texture-tile';

export type RulerUnit = 'stitches' | 'cm' | 'in';

export interface CanvasProps {
  editor: Editor;
  state: EditorState;
  textures: ReadonlyMap<string, Texture>;
  yarns: readonly Yarn[];
  /** Zone fill: the texture's rendering, or flat colour by texture. */
  fill: 'texture' | 'flat';
  rulerUnit: RulerUnit;
  /** A finding's place to flash on the canvas. */
  highlight: { panelId: string; needle?: number; course?: number } | null;
  /** Colours for yarn ids (a colourway), when the map is shown in one. */
  yarnColours?: Readonly<Record<string, string>>;
  /** Flat index colour of a texture (distinct within the style). */
  colourOf: (textureId: string) => string;
  /** The style's trims, drawn as boxes over the zones (placed and edited in the Trims section). */
  trims?: readonly { id: string; panelId: string; box: StitchBox; label: string }[];
}

const INK = '#1f2428';
const SPRUCE = '#22665a';
const SELECT = '#d1495b';

const flatPoints = (poly: readonly StitchPoint[]) => poly.flatMap((p) => [p.x, p.y]);

function pathOf(poly: readonly StitchPoint[]): string {
  return poly.map((p, i) => `${i ? 'L' : 'M'}${p.x} ${p.y}`).join(' ') + ' Z';
}

/** A zone filled with its texture's rendering, in the panel's stitch coordinates. */
const ZoneShape = memo(function ZoneShape({
  zone, texture, yarns, fill, selected, pxPerNeedle, pxPerCourse, pxPerCm, yarnColours, colour,
}: {
  zone: Zone; texture: Texture | undefined; yarns: readonly Yarn[]; fill: 'texture' | 'flat'; selected: boolean;
  pxPerNeedle: number; pxPerCourse: number; pxPerCm: number; yarnColours?: Readonly<Record<string, string>>; colour: string;
}) {
  // Below about 1.5 px per stitch the loops turn to noise: show the flat colour, and build no pattern
  // image at all (a tiny repeat at a coarse zoom would need thousands of repeats per image).
  const tooSmall = pxPerNeedle < 1.5 || pxPerCourse < 1.2;
  const pattern = useTexturePattern(fill === 'texture' && !tooSmall ? texture : undefined, yarns, { yarnColours, pxPerCm });
  const usePattern = fill === 'texture' && pattern && texture;
  // The group draws in stitch units: one needle of the pattern lands on one needle of the panel.
  const scaleX = usePattern ? 1 / pattern.pxPerNeedle : 1;
  const scaleY = usePattern ? 1 / pattern.pxPerCourse : 1;
  const points = flatPoints(zone.polygon);
  return (
    <>
    <Line
      points={points}
      closed
      {...(usePattern && !tooSmall
        ? { fillPatternImage: pattern.image as unknown as HTMLImageElement, fillPatternScaleX: scaleX, fillPatternScaleY: scaleY, fillPatternRepeat: 'repeat' }
        : { fill: colour, opacity: 0.92 })}
      stroke={selected ? SELECT : INK}
      strokeWidth={selected ? 2 : 1}
      strokeScaleEnabled={false}
      perfectDrawEnabled={false}
      listening={false}
    />
    {usePattern && !tooSmall ? (
      // A light tint of the texture's index colour, so neighbouring zones of similar yarns still read apart.
      <Line points={points} closed fill={colour} opacity={0.22} listening={false} perfectDrawEnabled={false} />
    ) : null}
    </>
  );
});

const PanelBase = memo(function PanelBase({ panel, layout, baseTexture, yarns, fill, pxPerCm, yarnColours, colour }: {
  panel: Panel; layout: PanelLayout; baseTexture: Texture | undefined; yarns: readonly Yarn[]; fill: 'texture' | 'flat';
  pxPerCm: number; yarnColours?: Readonly<Record<string, string>>; colour: string;
}) {
  const visible = layout.pxPerNeedle >= 1.5 && layout.pxPerCourse >= 1.2;
  const pattern = useTexturePattern(fill === 'texture' && visible ? baseTexture : undefined, yarns, { yarnColours, pxPerCm });
  const w = panel.widthNeedles;
  const h = panel.heightCourses;
  const usePattern = fill === 'texture' && pattern && baseTexture && visible;
  return (
    <>
      <Line
        points={flatPoints(panel.knittedArea)}
        closed
        {...(usePattern
          ? {
              fillPatternImage: pattern.image as unknown as HTMLImageElement,
              fillPatternScaleX: 1 / pattern.pxPerNeedle,
              fillPatternScaleY: 1 / pattern.pxPerCourse,
            }
          : { fill: panel.baseTextureId ? colour : '#ece9e1' })}
        opacity={0.55}
        stroke="#8d938f"
        strokeWidth={1}
        strokeScaleEnabled={false}
        listening={false}
      />
      <Path data={`M0 0 L${w} 0 L${w} ${h} L0 ${h} Z ${pathOf(panel.cutOutline)}`} fillRule="evenodd" fill="rgba(246,245,241,0.72)" listening={false} />
    </>
  );
});

function CutLines({ panel }: { panel: Panel }) {
  return (
    <>
      <Line points={flatPoints(panel.cutOutline)} closed stroke={SPRUCE} strokeWidth={1.6} dash={[6, 4]} strokeScaleEnabled={false} listening={false} />
      <Line points={[panel.widthNeedles / 2, 0, panel.widthNeedles / 2, panel.heightCourses]} stroke="#6b7b8c" strokeWidth={1} dash={[2, 5]} strokeScaleEnabled={false} listening={false} />
    </>
  );
}

/** Tick spacing in stitches for about one label every `minPx` pixels, on round numbers. */
function tickStep(pxPerUnit: number, minPx: number): number {
  const steps = [1, 2, 5, 10, 20, 25, 50, 100, 200, 250, 500, 1000, 2000];
  return steps.find((s) => s * pxPerUnit >= minPx) ?? 5000;
}

/**
 * A panel's rulers and name. `roomLeftPx` is the free space to its left (the gap after the panel
 * before it, or the margin for the first): the course numbers are written only where they fit
 * there, so they never sit on the neighbouring panel; the ticks are always drawn.
 */
function Rulers({ panel, layout, unit, roomLeftPx }: { panel: Panel; layout: PanelLayout; unit: RulerUnit; roomLeftPx: number }) {
  const out: React.ReactNode[] = [];
  const { origin, pxPerNeedle, pxPerCourse } = layout;
  const perUnitX = unit === 'stitches' ? 1 : unit === 'cm' ? layout.density.walesPerCm : layout.density.walesPerCm * 2.54;
  const perUnitY = unit === 'stitches' ? 1 : unit === 'cm' ? layout.density.coursesPerCm : layout.density.coursesPerCm * 2.54;
  const stepX = tickStep(pxPerNeedle * perUnitX, 48);
  const stepY = tickStep(pxPerCourse * perUnitY, 36);
  const maxX = panel.widthNeedles / perUnitX;
  const maxY = panel.heightCourses / perUnitY;
  const top = origin.y - 6;
  const left = origin.x - 6;
  const rightPx = origin.x + panel.widthNeedles * pxPerNeedle;
  for (let v = 0; v <= maxX + 1e-9; v += stepX) {
    const x = origin.x + v * perUnitX * pxPerNeedle;
    out.push(<Line key={`x${v}`} points={[x, top - 5, x, top]} stroke="#7b8288" strokeWidth={1} listening={false} />);
    // A number close to the panel's right edge is written to the left of its tick, not over the gap.
    const flip = v > 0 && x + 30 > rightPx;
    out.push(<Text key={`xt${v}`} x={flip ? x - 38 : x + 2} width={flip ? 36 : undefined} align={flip ? 'right' : 'left'} y={top - 15} text={String(v)} fontSize={10} fontFamily="var(--font-figures), monospace" fill="#7b8288" listening={false} />);
  }
  const courseNumbers = roomLeftPx >= 50;
  for (let v = 0; v <= maxY + 1e-9; v += stepY) {
    const y = origin.y + v * perUnitY * pxPerCourse;
    out.push(<Line key={`y${v}`} points={[left - 5, y, left, y]} stroke="#7b8288" strokeWidth={1} listening={false} />);
    if (courseNumbers) out.push(<Text key={`yt${v}`} x={left - 44} y={y - 5} width={36} align="right" text={String(v)} fontSize={10} fontFamily="var(--font-figures), monospace" fill="#7b8288" listening={false} />);
  }
  // The panel's size in the ruler's unit; cut short with an ellipsis rather than run into the next panel.
  const size = unit === 'stitches'
    ? `${panel.widthNeedles} × ${panel.heightCourses} needles × courses`
    : `${(maxX).toFixed(1)} × ${(maxY).toFixed(1)} ${unit}`;
  const titleWidth = Math.max(60, panel.widthNeedles * pxPerNeedle + 16);
  out.push(<Text key="name" x={origin.x} y={top - 34} width={titleWidth} wrap="none" ellipsis text={`${panel.name} · ${size}`} fontSize={12} fontStyle="600" fill={INK} listening={false} />);
  return <>{out}</>;
}

export default function BodyMapCanvas({ editor, state, textures, yarns, fill, rulerUnit, highlight, yarnColours, colourOf, trims }: CanvasProps) {
  const box = useRef<HTMLDivElement>(null);
  const stageRef = useRef<Konva.Stage>(null);
  /** Stops following the live press on the window (set while a press that began on the stage is down). */
  const stopFollowing = useRef<(() => void) | null>(null);
  const [size, setSize] = useState({ w: 800, h: 600 });

  useEffect(() => () => stopFollowing.current?.(), []);

  useEffect(() => {
    const el = box.current;
    if (!el) return;
    let first = true;
    const ro = new ResizeObserver(([entry]) => {
      if (!entry) return;
      const w = Math.max(200, Math.floor(entry.contentRect.width));
      const h = Math.max(200, Math.floor(entry.contentRect.height));
      setSize({ w, h });
      editor.setViewport({ widthPx: w, heightPx: h });
      // The first real size: fit the panels to it (the editor started from a guessed viewport).
      if (first) { first = false; editor.zoomToFit(); }
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, [editor]);

  const layouts = editor.layout();
  // Pattern images at about the screen's resolution (the tile cache quantizes it in steps of √2).
  const dpr = typeof window === 'undefined' ? 1 : window.devicePixelRatio || 1;
  const patternPxPerCm = Math.max(8, Math.min(state.camera.pxPerCm * dpr, 400));
  const selected = new Set(state.selection.zoneIds);
  /** The editor's pointer input: a stage position and the event's button and modifier keys. */
  const toInput = (pos: { x: number; y: number }, ev: PointerEvent | MouseEvent) =>
    ({ screen: { x: pos.x, y: pos.y }, button: ev.button, shift: ev.shiftKey, alt: ev.altKey, ctrl: ev.ctrlKey, meta: ev.metaKey });
  const pointer = (e: Konva.KonvaEventObject<PointerEvent | MouseEvent>) =>
    toInput(e.target.getStage()?.getPointerPosition() ?? { x: 0, y: 0 }, e.evt);
  // A press that began on the stage is followed on the window until it is released or cancelled,
  // so a drag let go off the canvas still ends (and autosave is no longer held back by it).
  const followPress = (pointerId: number) => {
    stopFollowing.current?.();
    const fromWindow = (ev: PointerEvent) => {
      const stage = stageRef.current;
      stage?.setPointersPositions(ev);
      return toInput(stage?.getPointerPosition() ?? { x: 0, y: 0 }, ev);
    };
    const move = (ev: PointerEvent) => { if (ev.pointerId === pointerId) editor.pointerMove(fromWindow(ev)); };
    const end = (ev: PointerEvent) => {
      if (ev.pointerId !== pointerId) return;
      stop();
      editor.pointerUp(fromWindow(ev));
    };
    const stop = () => {
      window.removeEventListener('pointermove', move);
      window.removeEventListener('pointerup', end);
      window.removeEventListener('pointercancel', end);
      if (stopFollowing.current === stop) stopFollowing.current = null;
    };
    window.addEventListener('pointermove', move);
    window.addEventListener('pointerup', end);
    window.addEventListener('pointercancel', end);
    stopFollowing.current = stop;
  };

  const tool = state.tool;
  const cursor =
    state.panGesture || (tool.tool === 'pan') || state.spaceHeld ? 'grab'
      : tool.tool === 'draw-zone' ? 'crosshair'
        : tool.tool === 'zoom' ? 'zoom-in'
          : tool.tool === 'select' && tool.state === 'idle' && tool.hover?.kind === 'vertex' ? 'move'
            : 'default';

  return (
    <div
      ref={box}
      className="absolute inset-0"
      style={{ cursor }}
      data-testid="body-map-canvas"
      // Panel rectangles on screen, for tests and tools that drive the canvas with a pointer.
      data-panels={JSON.stringify(layouts.map((l) => ({ id: l.panelId, x: Math.round(l.origin.x), y: Math.round(l.origin.y), w: Math.round(l.widthPx), h: Math.round(l.heightPx) })))}
    >
      <Stage
        ref={stageRef}
        width={size.w}
        height={size.h}
        onPointerDown={(e) => { box.current?.focus(); followPress(e.evt.pointerId); editor.pointerDown(pointer(e)); }}
        // While a press is followed on the window, its moves and release arrive from there.
        onPointerMove={(e) => { if (!stopFollowing.current) editor.pointerMove(pointer(e)); }}
        onWheel={(e) => {
          e.evt.preventDefault();
          const pos = e.target.getStage()?.getPointerPosition() ?? { x: 0, y: 0 };
          editor.wheel({ screen: pos, deltaY: e.evt.deltaY, shift: e.evt.shiftKey, ctrl: e.evt.ctrlKey });
        }}
        onContextMenu={(e) => e.evt.preventDefault()}
      >
        <Layer listening={false}>
          {state.doc.panels.map((panel) => {
            const layout = layouts.find((l) => l.panelId === panel.id);
            if (!layout) return null;
            return (
              <Group key={panel.id} x={layout.origin.x} y={layout.origin.y} scaleX={layout.pxPerNeedle} scaleY={layout.pxPerCourse}>
                <PanelBase panel={panel} layout={layout} baseTexture={textures.get(panel.baseTextureId)} yarns={yarns} fill={fill} pxPerCm={patternPxPerCm} yarnColours={yarnColours} colour={colourOf(panel.baseTextureId)} />
                {zonesInDrawOrder(panel).map((z) => (
                  <ZoneShape
                    key={z.id}
                    zone={z}
                    texture={textures.get(z.textureId)}
                    yarns={yarns}
                    fill={fill}
                    selected={selected.has(z.id)}
                    pxPerNeedle={layout.pxPerNeedle}
                    pxPerCourse={layout.pxPerCourse}
                    pxPerCm={patternPxPerCm}
                    yarnColours={yarnColours}
                    colour={colourOf(z.textureId)}
                  />
                ))}
                <CutLines panel={panel} />
                {trims?.filter((t) => t.panelId === panel.id).map((t) => (
                  <Group key={t.id} x={t.box.x} y={t.box.y} listening={false}>
                    <Rect width={t.box.width} height={t.box.height} fill="rgba(255,255,255,0.55)" stroke={INK} strokeWidth={1} dash={[3, 2]} strokeScaleEnabled={false} />
                    <Text y={-14 / layout.pxPerCourse} scaleX={1 / layout.pxPerNeedle} scaleY={1 / layout.pxPerCourse} text={t.label} fontSize={10} fill={INK} />
                  </Group>
                ))}
              </Group>
            );
          })}
        </Layer>
        <Layer listening={false}>
          {state.doc.panels.map((panel) => {
            const i = layouts.findIndex((l) => l.panelId === panel.id);
            const layout = layouts[i];
            if (!layout) return null;
            const before = i > 0 ? layouts[i - 1] : undefined;
            const roomLeftPx = before ? layout.origin.x - (before.origin.x + before.widthPx) : layout.origin.x;
            return <Rulers key={panel.id} panel={panel} layout={layout} unit={rulerUnit} roomLeftPx={roomLeftPx} />;
          })}
          <Overlay state={state} layouts={layouts} highlight={highlight} />
        </Layer>
      </Stage>
    </div>
  );
}

function toScreen(layout: PanelLayout, p: StitchPoint) {
  return { x: layout.origin.x + p.x * layout.pxPerNeedle, y: layout.origin.y + p.y * layout.pxPerCourse };
}

/** Selection handles, the polygon being drawn, the marquee, and a finding's place. */
function Overlay({ state, layouts, highlight }: { state: EditorState; layouts: PanelLayout[]; highlight: CanvasProps['highlight'] }) {
  const nodes: React.ReactNode[] = [];
  const byPanel = new Map(layouts.map((l) => [l.panelId, l]));
  for (const panel of state.doc.panels) {
    const layout = byPanel.get(panel.id);
    if (!layout) continue;
    for (const z of panel.zones) {
      if (!state.selection.zoneIds.includes(z.id)) continue;
      z.polygon.forEach((p, i) => {
        const s = toScreen(layout, p);
        const active = state.selection.vertex?.zoneId === z.id && state.selection.vertex.index === i;
        nodes.push(<Rect key={`${z.id}-${i}`} x={s.x - 4} y={s.y - 4} width={8} height={8} fill={active ? SELECT : '#fff'} stroke={SELECT} strokeWidth={1.5} />);
      });
    }
    if (state.editOutline) {
      panel.cutOutline.forEach((p, i) => {
        const s = toScreen(layout, p);
        const active = state.selection.outlineVertex?.panelId === panel.id && state.selection.outlineVertex.index === i;
        nodes.push(<Circle key={`o-${panel.id}-${i}`} x={s.x} y={s.y} radius={4} fill={active ? SPRUCE : '#fff'} stroke={SPRUCE} strokeWidth={1.5} />);
      });
    }
  }
  const t = state.tool;
  if (t.tool === 'draw-zone' && t.state === 'drawing') {
    const layout = byPanel.get(t.panelId);
    if (layout) {
      const pts = [...t.points, ...(t.hover ? [t.hover] : [])].map((p) => toScreen(layout, p));
      nodes.push(<Line key="draw" points={pts.flatMap((p) => [p.x, p.y])} stroke={t.problem ? SELECT : SPRUCE} strokeWidth={1.5} dash={[5, 3]} />);
      t.points.forEach((p, i) => {
        const s = toScreen(layout, p);
        nodes.push(<Circle key={`dp${i}`} x={s.x} y={s.y} radius={i === 0 && t.overFirst ? 7 : 3.5} fill={i === 0 ? SPRUCE : '#fff'} stroke={SPRUCE} strokeWidth={1.5} />);
      });
    }
  }
  if (t.tool === 'draw-zone' && t.state === 'idle' && t.hover && t.hoverPanelId) {
    const layout = byPanel.get(t.hoverPanelId);
    if (layout) {
      const s = toScreen(layout, t.hover);
      nodes.push(<Circle key="hover" x={s.x} y={s.y} radius={3} stroke={SPRUCE} strokeWidth={1.5} />);
    }
  }
  if (t.tool === 'select' && t.state === 'marquee' && t.active) {
    const x = Math.min(t.downAt.x, t.current.x);
    const y = Math.min(t.downAt.y, t.current.y);
    nodes.push(<Rect key="marquee" x={x} y={y} width={Math.abs(t.current.x - t.downAt.x)} height={Math.abs(t.current.y - t.downAt.y)} stroke={SPRUCE} dash={[4, 3]} fill="rgba(44,122,107,0.08)" />);
  }
  if (highlight) {
    const layout = byPanel.get(highlight.panelId);
    if (layout) {
      const cx = highlight.needle !== undefined ? layout.origin.x + (highlight.needle + 0.5) * layout.pxPerNeedle : layout.origin.x + layout.widthPx / 2;
      const cy = highlight.course !== undefined ? layout.origin.y + (highlight.course + 0.5) * layout.pxPerCourse : layout.origin.y + layout.heightPx / 2;
      nodes.push(<Circle key="hl" x={cx} y={cy} radius={16} stroke="#b7831f" strokeWidth={3} dash={[4, 3]} />);
    }
  }
  return <>{nodes}</>;
}
