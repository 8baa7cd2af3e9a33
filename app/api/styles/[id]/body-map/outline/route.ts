import { NextResponse } from 'next/server';
import { z } from 'zod';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { findStyle } from '@/lib/db/styles';
import { idParamSchema } from '@/lib/validations/style';
import { panelLimits } from '@/lib/validations/body-map';
import { outlineFromSvg, OutlineError, svgOutlineLimits } from '@/lib/knit/svg-outline';
import { HttpError, notFound } from '@/lib/api/errors';

const bodySchema = z.object({
  svg: z.string().min(1, 'Choose an SVG file').max(svgOutlineLimits.maxBytes, 'The drawing is larger than 1 MB'),
  widthNeedles: z.number().int().min(8).max(panelLimits.maxNeedles),
  heightCourses: z.number().int().min(8).max(panelLimits.maxCourses),
});

/**
 * Turns an uploaded SVG outline into a cut-line polygon for a panel of the given size. Only the
 * path geometry is read; nothing of the file is stored. The editor applies the polygon as an
 * undoable edit, saved with the map.
 */
export const POST = route<{ id: string }>(async (req, params) => {
  const user = await authorize('style:edit');
  const { id } = idParamSchema.parse(params);
  if (!(await findStyle(user, id))) throw notFound('Style not found.');
  const body = await parseBody(req, bodySchema);
  try {
    return NextResponse.json({ polygon: outlineFromSvg(body.svg, body) });
  } catch (err) {
    if (err instanceof OutlineError) throw new HttpError(400, err.message, { fieldErrors: { svg: [err.message] } });
    throw err;
  }
});
