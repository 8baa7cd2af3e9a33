/**
 * The messages the local SMTP fake caught (development and tests only): one JSON file per message
 * in the folder named by NEEDLEMAP_MAIL_DIR, written by the SMTP fake (tests/fakes/start.ts).
 */
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';

export interface CaughtMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export function caughtMailDir(env: NodeJS.ProcessEnv = process.env): string | null {
  return env.NEEDLEMAP_MAIL_DIR ? path.resolve(env.NEEDLEMAP_MAIL_DIR) : null;
}

/** Caught messages, newest first; empty when the folder is not set or not there yet. */
export async function listCaughtMail(dir: string | null = caughtMailDir(), limit = 200): Promise<CaughtMail[]> {
  if (!dir) return [];
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith('.json'));
  } catch {
    return [];
  }
  names.sort().reverse();
  const out: CaughtMail[] = [];
  for (const n of names.slice(0, limit)) {
    try {
      out.push(JSON.parse(await readFile(path.join(dir, n), 'utf8')) as CaughtMail);
    } catch {
      // A message still being written is skipped until it is complete.
    }
  }
  return out;
}
