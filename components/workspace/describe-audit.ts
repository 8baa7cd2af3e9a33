import { isPointKey, pointsOfMeasure } from '@/lib/fit/points';

const verbs: Record<string, string> = {
  'style.create': 'Created the style',
  'style.update': 'Edited',
  'style.archive': 'Archived the style',
  'style.share': 'Shared with',
  'style.unshare': 'Stopped sharing',
  'body-map.save': 'Saved the body map',
  'fit.spec.save': 'Saved the size spec',
  'fit.factor': 'Changed the studio seamless factor',
  'fit.round.create': 'Recorded sample round',
  'fit.round.update': 'Edited sample round',
  'fit.round.comment': 'Commented on sample round',
  'fit.correction.propose': 'Proposed a correction',
  'fit.correction.accept': 'Accepted a correction',
  'fit.correction.reject': 'Rejected a correction',
};

/** One line of plain words for an audit entry. */
export function describeAudit(action: string, details: Record<string, unknown>): string {
  const verb = verbs[action] ?? action;
  if (action === 'style.update') return `${verb}: ${Object.keys(details).join(', ') || 'no fields'}`;
  if (action === 'style.share') return `${verb} ${String(details.organisation ?? '')}`;
  if (action === 'body-map.save' && typeof details.zones === 'number') return `${verb} (${details.zones} zones)`;
  if (action.startsWith('fit.')) return describeFit(action, verb, details);
  return verb;
}

/** Size spec, sample-round and correction entries: which points, which round, from what to what (cm). */
function describeFit(action: string, verb: string, d: Record<string, unknown>): string {
  const num = (v: unknown) => (typeof v === 'number' ? v.toFixed(1) : '—');
  if (action === 'fit.spec.save') {
    const points = Array.isArray(d.changedPoints) ? d.changedPoints.length : 0;
    return `${verb}${points ? ` (${points} point${points === 1 ? '' : 's'} changed)` : ''}`;
  }
  if (action === 'fit.factor') return `${verb}: ${typeof d.from === 'number' ? d.from.toFixed(4) : '—'} → ${typeof d.to === 'number' ? d.to.toFixed(4) : '—'}`;
  if (action.startsWith('fit.round.')) return `${verb} ${String(d.roundNo ?? '')}${typeof d.size === 'string' ? ` (${String(d.kind ?? '')}, size ${d.size})` : ''}`;
  const scope = d.scope === 'point' ? ', every size' : '';
  const point = typeof d.point === 'string' && isPointKey(d.point) ? pointsOfMeasure[d.point].label.toLowerCase() : String(d.point ?? '');
  const change = action === 'fit.correction.propose' ? `→ ${num(d.toCm)}` : `${num(d.fromCm)} → ${num(d.toCm)}`;
  return `${verb} from round ${String(d.roundNo ?? '?')}: ${point} of ${String(d.size ?? '')} ${change} cm${scope}`;
}
