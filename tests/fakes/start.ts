/**
 * The local fakes for development and tests, in one process: an S3 fake (s3rver, files in a
 * folder) and an SMTP fake (smtp-server, no authentication needed, no TLS) that keeps every message
 * it receives as a JSON file (and the raw .eml) in a folder, where the development mail page and the
 * tests read them. Both listen on 127.0.0.1 only.
 *
 *   node --import tsx tests/fakes/start.ts [--s3-port 4569] [--smtp-port 2525] [--s3-dir .data/s3]
 *        [--mail-dir .data/mail] [--bucket needlemap-files] [--parent-pid PID]
 *
 * Port 0 picks a free port. Prints one JSON line with the ports and folders once both listen, then
 * runs until SIGTERM/SIGINT or until the parent process is gone.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import S3rver from 's3rver';
import { SMTPServer } from 'smtp-server';
import { simpleParser, type AddressObject } from 'mailparser';

function arg(name: string, fallback: string): string {
  const i = process.argv.indexOf(`--${name}`);
  return i >= 0 && process.argv[i + 1] !== undefined ? process.argv[i + 1]! : fallback;
}

const s3Port = Number(arg('s3-port', '4569'));
const smtpPort = Number(arg('smtp-port', '2525'));
const s3Dir = path.resolve(arg('s3-dir', '.data/s3'));
const mailDir = path.resolve(arg('mail-dir', '.data/mail'));
const bucket = arg('bucket', 'needlemap-files');
const parentPid = Number(arg('parent-pid', '0'));

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  if (!a) return [];
  return (Array.isArray(a) ? a : [a]).flatMap((x) => x.value.map((v) => v.address ?? '').filter(Boolean));
}

let seq = 0;

async function main() {
  await mkdir(s3Dir, { recursive: true });
  await mkdir(mailDir, { recursive: true });

  const s3 = new S3rver({ address: '127.0.0.1', port: s3Port, directory: s3Dir, silent: true, configureBuckets: [{ name: bucket, configs: [] }] });
  const s3Address = await s3.run();

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    size: 30 * 1024 * 1024,
    logger: false,
    banner: 'Needlemap local mail fake',
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('end', async () => {
        try {
          const raw = Buffer.concat(chunks);
          const parsed = await simpleParser(raw);
          const receivedAt = new Date().toISOString();
          const id = `${receivedAt.replace(/[-:.TZ]/g, '')}-${process.pid}-${(seq++).toString().padStart(4, '0')}`;
          const envelopeTo = session.envelope.rcptTo.map((r) => r.address);
          const message = {
            id,
            receivedAt,
            from: (session.envelope.mailFrom && session.envelope.mailFrom.address) || parsed.from?.text || '',
            to: envelopeTo.length ? envelopeTo : addresses(parsed.to),
            subject: parsed.subject ?? '',
            text: parsed.text ?? '',
            html: typeof parsed.html === 'string' ? parsed.html : null,
          };
          await writeFile(path.join(mailDir, `${id}.eml`), raw);
          // Written last and renamed into place so a reader never sees half a message.
          const tmp = path.join(mailDir, `.${id}.tmp`);
          await writeFile(tmp, JSON.stringify(message, null, 2));
          const { rename } = await import('node:fs/promises');
          await rename(tmp, path.join(mailDir, `${id}.json`));
          callback();
        } catch (err) {
          callback(err as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(smtpPort, '127.0.0.1', () => resolve());
  });
  const smtpAddress = smtp.server.address() as AddressInfo;

  process.stdout.write(
    JSON.stringify({ s3Port: s3Address.port, smtpPort: smtpAddress.port, s3Dir, mailDir, bucket, s3Endpoint: `http://127.0.0.1:${s3Address.port}` }) + '\n',
  );

  let closing = false;
  const stop = async () => {
    if (closing) return;
    closing = true;
    await Promise.allSettled([s3.close(), new Promise<void>((r) => smtp.close(() => r()))]);
    process.exit(0);
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
  if (parentPid > 0) {
    setInterval(() => {
      try {
        process.kill(parentPid, 0);
      } catch {
        void stop();
      }
    }, 1000).unref();
  }
}

main().catch((err) => {
  console.error('The local fakes could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
