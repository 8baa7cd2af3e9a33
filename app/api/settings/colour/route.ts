import { NextResponse } from 'next/server';
import { route, parseBody } from '@/lib/api/handler';
import { authorize } from '@/lib/auth/authorize';
import { readColourSettings, setColourSettings } from '@/lib/db/colour-settings';
import { colourSettingsPutSchema } from '@/lib/validations/colour-settings';

/** The studio's colour settings: lab-dip tolerance for targets without a standard, low-contrast ΔE00. */
export const GET = route(async () => {
  const user = await authorize('library:read');
  return NextResponse.json({ colour: await readColourSettings(user) });
});

export const PUT = route(async (req) => {
  const user = await authorize('colour:edit');
  return NextResponse.json({ colour: await setColourSettings(user, await parseBody(req, colourSettingsPutSchema)) });
});
