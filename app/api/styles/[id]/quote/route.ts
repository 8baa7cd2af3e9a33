import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { loadQuote, saveQuoteInputs } from '@/lib/db/quotes';
import { quoteSaveSchema } from '@/lib/validations/quote';
import { idParamSchema } from '@/lib/validations/style';

type Params = { id: string };

/** The quote of a style: studio staff only (never the mill or the client). */
export const GET = route<Params>(async (_req, params) => {
  const user = await authorize('quote:read');
  const { id } = idParamSchema.parse(params);
  return NextResponse.json({ quote: await loadQuote(user, id) });
});

/** Saves the quote entries at their version (0 for the first save); a stale version gets 409. */
export const PUT = route<Params>(async (req, params) => {
  const user = await authorize('quote:edit');
  const { id } = idParamSchema.parse(params);
  const input = await parseBody(req, quoteSaveSchema);
  return NextResponse.json({ quote: await saveQuoteInputs(user, id, input) });
});
