import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { isOutsideRole } from '@/lib/auth/roles';
import { env } from '@/lib/env';
import { caughtMailDir, listCaughtMail } from '@/lib/mail/caught';
import { Card, PageHeader } from '@/components/ui/card';

export const metadata: Metadata = { title: 'Caught mail (development)' };
export const dynamic = 'force-dynamic';

/** Development only: the e-mails the local SMTP fake caught. */
export default async function DevMailPage() {
  if (!env().devPages) notFound();
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  if (isOutsideRole(user.role)) notFound();
  const dir = caughtMailDir();
  const mails = await listCaughtMail(dir);
  return (
    <>
      <PageHeader eyebrow="Development only" title="Caught mail">
        <p className="mt-1 text-sm text-ink-soft">What the local mail fake received{dir ? '' : ' (NEEDLEMAP_MAIL_DIR is not set: nothing is caught)'}. Nothing here leaves this machine.</p>
      </PageHeader>
      {mails.length === 0 ? <Card><p className="text-sm text-ink-soft">No messages yet.</p></Card> : null}
      <ol className="space-y-3">
        {mails.map((m) => (
          <li key={m.id}>
            <Card title={m.subject || '(no subject)'} actions={<time className="figures text-xs text-ink-faint" dateTime={m.receivedAt}>{m.receivedAt.slice(0, 19).replace('T', ' ')}</time>}>
              <p className="mb-2 text-xs text-ink-soft">From {m.from} to {m.to.join(', ')}</p>
              <pre className="whitespace-pre-wrap font-sans text-sm">{m.text}</pre>
            </Card>
          </li>
        ))}
      </ol>
    </>
  );
}
