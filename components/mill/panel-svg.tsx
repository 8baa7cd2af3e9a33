import type { Panel } from '@/lib/knit/panel';

/** A panel drawn flat: knitted area, zones in their textures' index colours (stacking order), cut line dashed. */
export function PanelSvg({ panel, colours, names, walesPerCm, coursesPerCm }: {
  panel: Panel; colours: Record<string, string>; names: Record<string, string>; walesPerCm: number; coursesPerCm: number;
}) {
  // Drawn at the relaxed proportions of the base texture: x in needles, y in courses, scaled to cm.
  const sx = 1 / walesPerCm;
  const sy = 1 / coursesPerCm;
  const w = panel.widthNeedles * sx;
  const h = panel.heightCourses * sy;
  const pts = (poly: Panel['knittedArea']) => poly.map((p) => `${(p.x * sx).toFixed(2)},${(p.y * sy).toFixed(2)}`).join(' ');
  const clipId = `ka-${panel.id}`;
  return (
    <figure className="space-y-1">
      <svg viewBox={`-0.5 -0.5 ${w + 1} ${h + 1}`} className="h-80 w-auto max-w-full" role="img" aria-label={`${panel.name}: ${panel.zones.length} zones`}>
        <defs><clipPath id={clipId}><polygon points={pts(panel.knittedArea)} /></clipPath></defs>
        <polygon points={pts(panel.knittedArea)} fill={colours[panel.baseTextureId] ?? '#ccc'} stroke="#1f2428" strokeWidth={0.15} />
        <g clipPath={`url(#${clipId})`}>
          {[...panel.zones].sort((a, b) => a.order - b.order).map((z) => (
            <polygon key={z.id} points={pts(z.polygon)} fill={colours[z.textureId] ?? '#999'} stroke="#ffffff" strokeWidth={0.12}>
              <title>{`${z.name}: ${names[z.textureId] ?? z.textureId}`}</title>
            </polygon>
          ))}
        </g>
        <polygon points={pts(panel.cutOutline)} fill="none" stroke="#1f2428" strokeWidth={0.3} strokeDasharray="1.2 0.7" />
      </svg>
      <figcaption className="text-xs text-ink-soft">
        {panel.name} · <span className="figures">{panel.widthNeedles} × {panel.heightCourses}</span> needles × courses · dashed: cut line
      </figcaption>
    </figure>
  );
}
