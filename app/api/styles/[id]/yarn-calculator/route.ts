import { NextResponse } from 'next/server';
import { route, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { yarnCalculatorFor } from '@/lib/db/yarn-calculator';
import { idParamSchema } from '@/lib/validations/style';
import { yarnCalculatorQuerySchema } from '@/lib/validations/yarn-calculator';

type Params = { id: string };

/**
 * The yarn calculator's figures from the saved body map: per texture, per size, the run's order
 * (`?qty=S:120,M:200`), content, labels and care advice, at `?waste=` % and `?method=`. Prices and
 * costs are for studio accounts only.
 */
export const GET = route<Params>(async (req, params) => {
  const user = await authorize('style:working-copy');
  const { id } = idParamSchema.parse(params);
  const query = parseQuery(req, yarnCalculatorQuerySchema);
  return NextResponse.json(await yarnCalculatorFor(user, id, query));
});
