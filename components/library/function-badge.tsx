import { textureFunctionLabels, type TextureFunction } from '@/lib/validations/library';

const tones: Record<TextureFunction, string> = {
  compression: 'bg-indigo-thread/10 text-indigo-thread ring-1 ring-indigo-thread/20',
  ventilation: 'bg-spruce-50 text-spruce-700 ring-1 ring-spruce-100',
  support: 'bg-ochre-50 text-ochre-700 ring-1 ring-ochre-500/20',
  'colour-block': 'bg-madder-50 text-madder-700 ring-1 ring-madder-500/20',
};

export function FunctionBadge({ fn }: { fn: TextureFunction | null }) {
  if (!fn) return <span className="text-xs text-ink-faint">General</span>;
  return (
    <span className={`inline-flex items-center whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-medium ${tones[fn]}`}>
      {textureFunctionLabels[fn]}
    </span>
  );
}
