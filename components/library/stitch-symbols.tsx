import type { StitchAction } from '@/lib/knit/texture';

/**
 * Needlemap's own stitch-chart symbols: knit a filled rounded square in ink, tuck a small arch
 * (the held loop) in ochre on a pale ground, miss a short dash on paper.
 */
export const actionStyle: Record<StitchAction, { label: string; key: string; fill: string; mark: string }> = {
  knit: { label: 'Knit', key: 'K', fill: '#ffffff', mark: '#1f2428' },
  tuck: { label: 'Tuck', key: 'T', fill: '#fbf4e4', mark: '#7d5811' },
  miss: { label: 'Miss', key: 'M', fill: '#f6f5f1', mark: '#7b8288' },
};

/** The symbol of one action inside a cell of `size` px at (x, y). */
export function StitchSymbol({ action, x, y, size }: { action: StitchAction; x: number; y: number; size: number }) {
  const s = actionStyle[action];
  switch (action) {
    case 'knit': {
      const inset = size * 0.24;
      const w = size - 2 * inset;
      return <rect x={x + inset} y={y + inset} width={w} height={w} rx={w * 0.28} fill={s.mark} />;
    }
    case 'tuck': {
      const l = x + size * 0.26;
      const r = x + size * 0.74;
      const base = y + size * 0.7;
      const top = y + size * 0.22;
      return (
        <path
          d={`M ${l} ${base} C ${l} ${top}, ${r} ${top}, ${r} ${base}`}
          fill="none"
          stroke={s.mark}
          strokeWidth={Math.max(1.25, size * 0.09)}
          strokeLinecap="round"
        />
      );
    }
    case 'miss':
      return (
        <line
          x1={x + size * 0.3}
          x2={x + size * 0.7}
          y1={y + size / 2}
          y2={y + size / 2}
          stroke={s.mark}
          strokeWidth={Math.max(1.25, size * 0.08)}
          strokeLinecap="round"
        />
      );
  }
}

/** A legend swatch: the symbol on its cell colour. */
export function SymbolSwatch({ action, size = 18 }: { action: StitchAction; size?: number }) {
  return (
    <svg width={size} height={size} viewBox={`0 0 ${size} ${size}`} aria-hidden className="shrink-0">
      <rect x={0.5} y={0.5} width={size - 1} height={size - 1} rx={3} fill={actionStyle[action].fill} stroke="#cbc6bb" />
      <StitchSymbol action={action} x={0} y={0} size={size} />
    </svg>
  );
}
