import { compressionFigureCaution } from '@/lib/fit/compression-target';

/** The caution that stands next to every compression figure; figures point to it with †. */
export function CompressionCaution({ id, compact = false }: { id?: string; compact?: boolean }) {
  return (
    <p id={id} data-testid="compression-caution" className={`flex gap-1.5 text-ochre-700 ${compact ? 'border-l-2 border-ochre-500/50 pl-2 text-2xs leading-snug' : 'rounded border border-ochre-500/30 bg-ochre-50 px-2.5 py-1.5 text-xs'}`}>
      <span aria-hidden className="font-semibold">†</span>
      <span>{compressionFigureCaution}</span>
    </p>
  );
}
