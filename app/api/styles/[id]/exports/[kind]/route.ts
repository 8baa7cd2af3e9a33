import { route, parseQuery } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { styleExport } from '@/lib/db/exports';
import { exportParamsSchema, exportQuerySchema } from '@/lib/validations/mill';

/**
 * One export of a style: swatch-sheet.pdf, tile.png, stitch-map.png / .csv / .json, yarn-list.csv.
 * `?release=` prints a released revision as it was released; without it, staff get the working copy
 * and a mill the latest release sent to it.
 */
export const GET = route<{ id: string; kind: string }>(async (req, params) => {
  const user = await authorize('mill:download');
  const { id, kind } = exportParamsSchema.parse(params);
  const query = parseQuery(req, exportQuerySchema);
  const out = await styleExport(user, id, kind, query);
  return new Response(Buffer.from(out.body), {
    headers: {
      'content-type': out.contentType,
      'content-disposition': `attachment; filename="${out.fileName}"`,
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
    },
  });
});
