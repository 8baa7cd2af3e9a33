import { route, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { yarnOrderCsv } from '@/lib/db/yarn-calculator';
import { idParamSchema } from '@/lib/validations/style';
import { yarnCalculatorQuerySchema } from '@/lib/validations/yarn-calculator';

type Params = { id: string };

/** The run's yarn order as CSV, with the calculator's options; prices only for studio accounts. */
export const GET = route<Params>(async (req, params) => {
  const user = await authorize('style:working-copy');
  const { id } = idParamSchema.parse(params);
  const query = parseQuery(req, yarnCalculatorQuerySchema);
  const { fileName, body } = await yarnOrderCsv(user, id, query);
  return new Response(body, {
    headers: {
      'content-type': 'text/csv; charset=utf-8',
      'content-disposition': `attachment; filename="${fileName}"`,
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
    },
  });
});
