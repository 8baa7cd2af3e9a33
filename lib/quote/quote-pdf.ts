/**
 * The quote as a PDF (jsPDF with the embedded fonts of lib/mill/pdf): per size, every cost line
 * with how it was computed, and the totals (cost, margin, order) with how they were computed; the
 * order by size first.
 */
import { createPdf, font, ink, pageNumbers, pdfBytes, wrappedText, type PdfPage } from '@/lib/mill/pdf';
import type { PaperSize } from '@/lib/mill/pack-data';
import type { StyleQuote } from '@/lib/db/quotes';
import { rateLabels } from '@/lib/cost/rates';

const money = (n: number | null, c: string) => (n === null ? '—' : `${n.toFixed(2)} ${c}`);

function header(p: PdfPage, q: StyleQuote, title: string) {
  const { doc, widthMm: w, marginMm: m } = p;
  font(doc, 'bold', 8.5);
  doc.text(`${q.styleCode} · ${q.styleName}`, m, m - 4);
  font(doc, 'regular', 8.5, ink.soft);
  doc.text(`Quote · ${new Date().toISOString().slice(0, 10)}`, w - m, m - 4, { align: 'right' });
  doc.setDrawColor(ink.rule);
  doc.setLineWidth(0.2);
  doc.line(m, m - 2.2, w - m, m - 2.2);
  font(doc, 'bold', 14);
  doc.text(title, m, m + 5);
}

export function quotePdf(q: StyleQuote, paper: PaperSize = 'a4'): Uint8Array {
  const p = createPdf(paper, { title: `${q.styleCode} quote`, subject: 'Cost per garment and per order' });
  const { doc, widthMm: w, heightMm: h, marginMm: m } = p;
  const c = q.quote.currency;
  let y = 0;
  const newPage = (title: string) => {
    header(p, q, title);
    y = m + 13;
  };
  const room = (need: number, title: string) => {
    if (y + need > h - m) {
      doc.addPage();
      newPage(title);
    }
  };
  newPage('Quote');
  font(doc, 'regular', 8.5, ink.soft);
  for (const line of [...q.basis, ...q.quote.problems]) y += wrappedText(doc, line, m, y, w - 2 * m, 4);
  if (q.studio.defaults.length) {
    font(doc, 'regular', 8.5, ink.warn);
    y += wrappedText(doc, `Rates still at an example value (${q.studio.note}): ${q.studio.defaults.map((k) => rateLabels[k] ?? k).join(', ')}.`, m, y, w - 2 * m, 4);
  }
  y += 3;
  // The order by size.
  font(doc, 'bold', 10);
  doc.text('Order by size', m, y);
  y += 5;
  const cols = [m, m + 22, m + 48, m + 84, m + 120, m + 152];
  font(doc, 'bold', 8);
  ['Size', 'Garments', 'Cost / garment', 'Margin / garment', 'Order cost', 'Order margin'].forEach((t, i) => doc.text(t, cols[i]!, y));
  y += 4.5;
  font(doc, 'mono', 8);
  for (const s of q.quote.sizes) {
    [s.size, String(s.garments), money(s.perGarment, c), money(s.marginPerGarment, c), money(s.orderCost, c), money(s.orderMargin, c)].forEach((t, i) => doc.text(t, cols[i]!, y));
    y += 4.2;
  }
  font(doc, 'bold', 8);
  ['All', String(q.quote.order.garments), '', q.quote.targetPricePerGarment === null ? '' : `target ${money(q.quote.targetPricePerGarment, c)}`, money(q.quote.order.cost, c), money(q.quote.order.margin, c)]
    .forEach((t, i) => doc.text(t, cols[i]!, y));
  y += 6;
  /** One figure with how it was computed: label and amount on a line, the how wrapped below, kept on one page. */
  const howRow = (label: string, amount: number | null, how: string, total: boolean) => {
    font(doc, 'regular', 7.5, ink.soft);
    const howLines = doc.splitTextToSize(how, w - 2 * m - 30) as string[];
    room(3.8 + howLines.length * 3.4 + 1, 'Quote (continued)');
    font(doc, total ? 'bold' : 'regular', 8.5);
    doc.text(label, m, y);
    font(doc, 'mono', 8.5);
    doc.text(money(amount, c), w - m, y, { align: 'right' });
    y += 3.8;
    font(doc, 'regular', 7.5, ink.soft);
    y += wrappedText(doc, how, m + 3, y, w - 2 * m - 30, 3.4) + 1;
  };
  const totals = (rows: { label: string; amount: number | null; how: string | null }[]) => {
    for (const t of rows) if (t.how !== null) howRow(t.label, t.amount, t.how, true);
  };
  // How the order totals were computed.
  room(12, 'Quote (continued)');
  font(doc, 'bold', 8.5);
  doc.text('How the order totals were computed', m, y);
  y += 4.5;
  totals([
    { label: 'Order cost', amount: q.quote.order.cost, how: q.quote.order.how.cost },
    { label: 'Order at the target price', amount: q.quote.order.revenue, how: q.quote.order.how.revenue },
    { label: 'Order margin', amount: q.quote.order.margin, how: q.quote.order.how.margin },
  ]);
  y += 4;
  // Each size's lines and totals with how they were computed.
  for (const s of q.quote.sizes) {
    room(20, 'Quote (continued)');
    font(doc, 'bold', 10);
    doc.text(`Size ${s.size}: ${money(s.perGarment, c)} per garment`, m, y);
    y += 5;
    for (const l of s.lines) howRow(l.label, l.amount, l.how, false);
    totals([
      { label: 'Cost per garment', amount: s.perGarment, how: s.how.perGarment },
      { label: 'Margin per garment', amount: s.marginPerGarment, how: s.how.margin },
      { label: `Order cost, size ${s.size}`, amount: s.orderCost, how: s.how.orderCost },
      { label: `Order margin, size ${s.size}`, amount: s.orderMargin, how: s.how.orderMargin },
    ]);
    y += 5;
  }
  pageNumbers(p);
  return pdfBytes(p);
}
