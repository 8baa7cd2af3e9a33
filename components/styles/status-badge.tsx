import { styleStatusLabels, type StyleStatus } from '@/lib/validations/style';

const tones: Record<StyleStatus, string> = {
  draft: 'bg-rule/70 text-ink-soft',
  developing: 'bg-spruce-50 text-spruce-700 ring-1 ring-spruce-100',
  'client-review': 'bg-ochre-50 text-ochre-700 ring-1 ring-ochre-500/20',
  released: 'bg-indigo-thread/10 text-indigo-thread ring-1 ring-indigo-thread/20',
  sampling: 'bg-madder-50 text-madder-700 ring-1 ring-madder-500/20',
  'production-ready': 'bg-spruce-600 text-white',
};

export function StatusBadge({ status }: { status: StyleStatus }) {
  return (
    <span className={`inline-flex items-center whitespace-nowrap rounded-full px-2 py-0.5 text-xs font-medium ${tones[status]}`}>
      {styleStatusLabels[status]}
    </span>
  );
}
