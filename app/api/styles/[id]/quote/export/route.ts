import { route, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { loadQuote } from '@/lib/db/quotes';
import { quoteCsv } from '@/lib/cost';
import { quotePdf } from '@/lib/quote/quote-pdf';
import { quoteExportQuerySchema } from '@/lib/validations/quote';
import { idParamSchema } from '@/lib/validations/style';

/** The quote as a download: `?format=pdf` or `?format=csv`. Studio staff only. */
export const GET = route<{ id: string }>(async (req, params) => {
  const user = await authorize('quote:read');
  const { id } = idParamSchema.parse(params);
  const { format } = parseQuery(req, quoteExportQuerySchema);
  const q = await loadQuote(user, id);
  const name = `${q.styleCode.replace(/[^\w.-]/g, '_')}-quote.${format}`;
  const body = format === 'pdf' ? Buffer.from(quotePdf(q)) : Buffer.from(quoteCsv(q.quote, { styleCode: q.styleCode, styleName: q.styleName }), 'utf8');
  return new Response(body, {
    headers: {
      'content-type': format === 'pdf' ? 'application/pdf' : 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${name}"`,
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
    },
  });
});
