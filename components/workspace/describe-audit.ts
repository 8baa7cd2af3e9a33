import { isPointKey, pointsOfMeasure } from '@/lib/fit/points';

const verbs: Record<string, string> = {
  'style.create': 'Created the style',
  'style.update': 'Edited',
  'style.archive': 'Archived the style',
  'style.share': 'Shared with',
  'style.unshare': 'Stopped sharing',
  'body-map.save': 'Saved the body map',
  'colourway.create': 'Created the colourway',
  'colourway.update': 'Edited the colourway',
  'colourway.archive': 'Archived the colourway',
  'lab-dip.submit': 'Sent a lab dip for',
  'lab-dip.decide': 'Decided on the lab dip',
  'fit.spec.save': 'Saved the size spec',
  'fit.factor': 'Changed the studio seamless factor',
  'fit.round.create': 'Recorded sample round',
  'fit.round.update': 'Edited sample round',
  'fit.round.comment': 'Commented on sample round',
  'fit.round.delete': 'Deleted sample round',
  'fit.round.photo.add': 'Added a photo to sample round',
  'fit.round.photo.remove': 'Removed a photo from sample round',
  'fit.correction.propose': 'Proposed a correction',
  'fit.correction.accept': 'Accepted a correction',
  'fit.correction.reject': 'Rejected a correction',
  'style.release': 'Released',
  'proposal.request': 'Asked for approval of',
  'proposal.comment': 'Commented on',
  'proposal.decide': 'Decided on',
  'test-knit.request': 'Requested test knits of',
  'test-knit.submit': 'Sent the test knit of',
  'test-knit.decide': 'Decided on the test knit of',
  'mill-pack.generate': 'Built the mill pack of',
  'file.upload': 'Uploaded',
  'mail.failed': 'Could not e-mail',
  'brief.save': 'Saved the brief',
  'brief.reference.add': 'Added a reference image',
  'brief.reference.edit': 'Edited a reference image',
  'brief.reference.reorder': 'Rearranged the reference board',
  'brief.reference.remove': 'Removed a reference image',
  'quote.save': 'Saved the quote entries',
  'studio.costing': 'Changed the studio costing rates',
};

/** A stored field name in plain words: `targetPrice` → `target price`. */
function fieldWords(field: string): string {
  return field.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
}

/** The `fields` of an entry in plain words, or null when it names none. */
function fieldList(d: Record<string, unknown>): string | null {
  if (!Array.isArray(d.fields)) return null;
  const names = d.fields.filter((f): f is string => typeof f === 'string');
  return names.length ? names.map(fieldWords).join(', ') : 'no fields';
}

/** A detail that should be text, or '' when it is missing or not text. */
const text = (v: unknown) => (typeof v === 'string' ? v : '');

/** One line of plain words for an audit entry. */
export function describeAudit(action: string, details: Record<string, unknown>): string {
  const verb = verbs[action] ?? action;
  if (action === 'style.update') return `${verb}: ${describeStyleFields(details) || 'no fields'}`;
  if (action === 'style.share') return `${verb} ${String(details.organisation ?? '')}`;
  if (action === 'style.unshare' && typeof details.organisation === 'string') {
    return `${verb} ${details.organisation}${details.reason === 'client changed' ? ' (no longer the client)' : ''}`;
  }
  if (action === 'body-map.save' && typeof details.zones === 'number') return `${verb} (${details.zones} zones)`;
  if (action.startsWith('colourway.') || action.startsWith('lab-dip.')) return describeColour(action, verb, details);
  if (action.startsWith('fit.')) return describeFit(action, verb, details);
  if (action.startsWith('brief.') || action === 'quote.save' || action === 'studio.costing') return describeBrief(action, verb, details);
  if (/^(style\.release|proposal\.|test-knit\.|mill-pack\.|file\.|mail\.)/.test(action)) return describeMill(action, verb, details);
  return verb;
}

const styleFieldLabels: Record<string, string> = {
  code: 'style code', name: 'name', season: 'season', client: 'client', clientId: 'client',
  garmentType: 'garment type', construction: 'construction', status: 'status', machine: 'machine setup', sizes: 'size range',
};

/**
 * The fields a style edit changed; short ones with their values as from → to. Older entries hold
 * only the new value of every field sent, and are listed by field name.
 */
function describeStyleFields(d: Record<string, unknown>): string {
  const shown = (v: unknown) => (v === null || v === '' ? 'none' : String(v));
  return Object.entries(d)
    .map(([key, value]) => {
      const label = styleFieldLabels[key] ?? key;
      if (value && typeof value === 'object' && 'from' in value && 'to' in value) {
        const { from, to } = value as { from: unknown; to: unknown };
        return `${label} (${shown(from)} → ${shown(to)})`;
      }
      return label;
    })
    .join(', ');
}

/** Releases, client reviews, test knits, mill packs, uploads: which revision, texture, mill or file. */
function describeMill(action: string, verb: string, d: Record<string, unknown>): string {
  const rev = typeof d.revision === 'number' ? `revision ${d.revision}` : '';
  switch (action) {
    case 'style.release':
      return `${verb} ${rev} to ${Array.isArray(d.mills) ? d.mills.join(', ') : 'the mills'}`;
    case 'proposal.request':
      return `${verb} ${rev} from ${text(d.client)}`;
    case 'proposal.decide':
      return `${d.decision === 'approved' ? 'Approved' : 'Asked for changes to'} ${rev}${text(d.client) ? ` (${text(d.client)})` : ''}`;
    case 'test-knit.request':
      return `${verb} ${rev}: ${String(d.requested ?? 0)} requested`;
    case 'test-knit.submit':
      return `${verb} ${text(d.texture)}${d.flagged ? ' (off plan)' : ''}`;
    case 'test-knit.decide':
      return `${d.decision === 'approved' ? 'Approved' : 'Asked for a change to'} the test knit of ${text(d.texture)} (${text(d.mill)})`;
    case 'mill-pack.generate':
      return `${verb} ${rev || 'the working copy'} (${String(d.pages ?? '?')} pages)`;
    case 'file.upload':
      return `${verb} ${text(d.name) || 'a file'} (${text(d.kind)})`;
    case 'mail.failed':
      return `${verb} ${Array.isArray(d.failed) && d.failed.length ? d.failed.join(', ') : 'the recipients'}`;
    default:
      return `${verb} ${rev}`.trim();
  }
}

/** Brief, reference-board and quote entries: which fields changed (never their values), which image. */
function describeBrief(action: string, verb: string, d: Record<string, unknown>): string {
  switch (action) {
    case 'brief.reference.add':
      return `${verb}${text(d.name) ? ` ${text(d.name)}` : ''}${text(d.tag) ? ` (${text(d.tag)})` : ''}`;
    case 'brief.reference.remove':
      return `${verb}${text(d.name) ? ` ${text(d.name)}` : ''}`;
    case 'brief.reference.reorder':
      return typeof d.count === 'number' ? `${verb} (${d.count} image${d.count === 1 ? '' : 's'})` : verb;
    default: {
      const fields = fieldList(d);
      return fields ? `${verb}: ${fields}` : verb;
    }
  }
}

/** Colourway and lab-dip entries: which colourway, target and dip, and the decision. */
function describeColour(action: string, verb: string, d: Record<string, unknown>): string {
  if (action === 'lab-dip.submit') {
    const dE = typeof d.deltaE === 'number' ? `, ΔE ${d.deltaE.toFixed(2)}` : '';
    return `${verb} ${text(d.colourway)} / ${text(d.target)} (#${String(d.sequence ?? '?')}${dE})`;
  }
  if (action === 'lab-dip.decide') {
    const decision = d.decision === 'approved' ? 'Approved' : d.decision === 'rejected' ? 'Rejected' : verb;
    const comment = text(d.comment) ? `: ${text(d.comment)}` : '';
    return `${decision} the lab dip ${text(d.colourway)} / ${text(d.target)} #${String(d.sequence ?? '?')}${comment}`;
  }
  const targets = Array.isArray(d.targets) ? ` (${d.targets.length} target${d.targets.length === 1 ? '' : 's'})` : '';
  return `${verb} ${text(d.name)}${targets}`;
}

/** Size spec, sample-round and correction entries: which points, which round, from what to what (cm). */
function describeFit(action: string, verb: string, d: Record<string, unknown>): string {
  const num = (v: unknown) => (typeof v === 'number' ? v.toFixed(1) : '—');
  if (action === 'fit.spec.save') {
    const points = Array.isArray(d.changedPoints) ? d.changedPoints.length : 0;
    return `${verb}${points ? ` (${points} point${points === 1 ? '' : 's'} changed)` : ''}`;
  }
  if (action === 'fit.factor') return `${verb}: ${typeof d.from === 'number' ? d.from.toFixed(4) : '—'} → ${typeof d.to === 'number' ? d.to.toFixed(4) : '—'}`;
  if (action.startsWith('fit.round.')) {
    const round = `${verb} ${String(d.roundNo ?? '')}${typeof d.size === 'string' ? ` (${String(d.kind ?? '')}, size ${d.size})` : ''}`;
    if (action.startsWith('fit.round.photo.')) return typeof d.name === 'string' && d.name ? `${round}: ${d.name}` : round;
    if (action === 'fit.round.delete') {
      const accepted = typeof d.corrections === 'object' && d.corrections !== null ? Number((d.corrections as Record<string, unknown>).accepted ?? 0) : 0;
      return accepted > 0 ? `${round}; the spec keeps its ${accepted} accepted correction${accepted === 1 ? '' : 's'}` : round;
    }
    return round;
  }
  const scope = d.scope === 'point' ? ', every size' : '';
  const point = typeof d.point === 'string' && isPointKey(d.point) ? pointsOfMeasure[d.point].label.toLowerCase() : String(d.point ?? '');
  const change = action === 'fit.correction.propose' ? `→ ${num(d.toCm)}` : `${num(d.fromCm)} → ${num(d.toCm)}`;
  return `${verb} from round ${String(d.roundNo ?? '?')}: ${point} of ${String(d.size ?? '')} ${change} cm${scope}`;
}

/** Entries that autosave writes many of in a row; the History page shows a run of them as one line. */
const repeatedActions = new Set(['body-map.save']);
/** Saves by one person less than this apart belong to one run. */
const auditRunGapMs = 30 * 60 * 1000;

/** A History line: one entry, or a run of the same repeated action by the same person. */
export interface AuditLine<E> {
  /** The newest entry of the run (what the line describes). */
  latest: E;
  /** The oldest entry of the run (the same as `latest` for a single entry). */
  earliest: E;
  count: number;
}

/**
 * The History page's lines from entries newest first: consecutive autosaves of the body map by the
 * same person, each less than `auditRunGapMs` after the one before, fold into one line that says how
 * many saves and over what time. Every entry is still kept in the audit log.
 */
export function auditLines<E extends { action: string; userId: string | null; createdAt: string }>(entries: readonly E[]): AuditLine<E>[] {
  const out: AuditLine<E>[] = [];
  for (const e of entries) {
    const run = out[out.length - 1];
    if (
      run && repeatedActions.has(e.action) && run.earliest.action === e.action && run.earliest.userId === e.userId &&
      Date.parse(run.earliest.createdAt) - Date.parse(e.createdAt) < auditRunGapMs
    ) {
      run.earliest = e;
      run.count += 1;
    } else {
      out.push({ latest: e, earliest: e, count: 1 });
    }
  }
  return out;
}
