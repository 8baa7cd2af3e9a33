const verbs: Record<string, string> = {
  'style.create': 'Created the style',
  'style.update': 'Edited',
  'style.archive': 'Archived the style',
  'style.share': 'Shared with',
  'style.unshare': 'Stopped sharing',
  'body-map.save': 'Saved the body map',
};

/** One line of plain words for an audit entry. */
export function describeAudit(action: string, details: Record<string, unknown>): string {
  const verb = verbs[action] ?? action;
  if (action === 'style.update') return `${verb}: ${Object.keys(details).join(', ') || 'no fields'}`;
  if (action === 'style.share') return `${verb} ${String(details.organisation ?? '')}`;
  if (action === 'body-map.save' && typeof details.zones === 'number') return `${verb} (${details.zones} zones)`;
  return verb;
}
