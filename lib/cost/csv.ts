/** The quote as CSV: one row per cost line per size, then totals per size and for the order. */
import { csv } from '@/lib/mill/csv';
import type { Quote } from './quote';

export function quoteCsv(q: Quote, meta: { styleCode: string; styleName: string }): string {
  const rows: (string | number | null)[][] = [
    ['style', 'size', 'line', 'group', `per garment (${q.currency})`, 'garments', `order (${q.currency})`, 'how'],
  ];
  for (const s of q.sizes) {
    for (const l of s.lines) rows.push([meta.styleCode, s.size, l.label, l.group, l.amount, s.garments, l.amount * s.garments, l.how]);
    rows.push([meta.styleCode, s.size, 'Total cost', 'total', s.perGarment, s.garments, s.orderCost, `${s.how.perGarment}; order: ${s.how.orderCost}`]);
    if (q.targetPricePerGarment !== null) {
      rows.push([meta.styleCode, s.size, 'Target price', 'total', q.targetPricePerGarment, s.garments, s.orderRevenue, 'From the brief']);
      rows.push([meta.styleCode, s.size, 'Margin', 'total', s.marginPerGarment, s.garments, s.orderMargin, `${s.how.margin ?? ''}; order: ${s.how.orderMargin ?? ''}`]);
    }
  }
  rows.push([meta.styleCode, 'all', 'Order cost', 'order', null, q.order.garments, q.order.cost, q.order.how.cost]);
  if (q.order.revenue !== null) {
    rows.push([meta.styleCode, 'all', 'Order at target price', 'order', null, q.order.garments, q.order.revenue, q.order.how.revenue ?? '']);
    rows.push([meta.styleCode, 'all', 'Order margin', 'order', null, q.order.garments, q.order.margin, q.order.how.margin ?? '']);
  }
  return csv(rows.map((r) => r.map((v) => (typeof v === 'number' ? Math.round(v * 10000) / 10000 : v))));
}
