/**
 * Helpers shared by the test global setups (the server project and the fault project): a free
 * port on loopback, waiting for a server to answer, and the local S3 and SMTP fakes.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { createServer } from 'node:net';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '../..');

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
    srv.on('error', reject);
  });
}

export async function waitFor(url: string, ms: number, server: ChildProcess, log: () => string) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    if (server.exitCode !== null) throw new Error(`The app server exited early:\n${log()}`);
    try {
      const res = await fetch(url);
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`The app server did not answer at ${url} within ${ms} ms:\n${log()}`);
}

/** Starts the S3 and SMTP fakes (tests/fakes/start.ts) on free ports; resolves with what they print. */
export async function startFakes(dir: string): Promise<{ proc: ChildProcess; s3Endpoint: string; smtpPort: number; mailDir: string; bucket: string }> {
  const proc = spawn(
    'node',
    ['--import', 'tsx', path.join(root, 'tests/fakes/start.ts'), '--s3-port', '0', '--smtp-port', '0',
      '--s3-dir', path.join(dir, 's3'), '--mail-dir', path.join(dir, 'mail'), '--parent-pid', String(process.pid)],
    { cwd: root, stdio: ['ignore', 'pipe', 'pipe'] },
  );
  let out = '';
  let err = '';
  proc.stderr?.on('data', (d) => (err += d));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`The local fakes did not start within 30 s:\n${err}`)), 30_000);
    proc.on('exit', (code) => reject(new Error(`The local fakes exited (${code}):\n${err}`)));
    proc.stdout?.on('data', (d) => {
      out += d;
      const line = out.split('\n')[0];
      if (!out.includes('\n') || !line) return;
      clearTimeout(timer);
      const info = JSON.parse(line) as { s3Endpoint: string; smtpPort: number; mailDir: string; bucket: string };
      resolve({ proc, ...info });
    });
  });
}
