import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { setStudioCostRates, studioCostRates } from '@/lib/db/quotes';
import { costRatesPutSchema } from '@/lib/validations/quote';

/** The studio costing rates, with the keys still at their example value. Studio staff only. */
export const GET = route(async () => {
  const user = await authorize('quote:read');
  return NextResponse.json({ costing: await studioCostRates(user) });
});

/** Writes the rates and mill rates the body names; absent ones keep theirs, null puts one back to its example value. */
export const PUT = route(async (req) => {
  const user = await authorize('quote:edit');
  const { rates, mills } = await parseBody(req, costRatesPutSchema);
  return NextResponse.json({ costing: await setStudioCostRates(user, rates, mills) });
});
