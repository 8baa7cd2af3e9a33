import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { can, canSeeCosts } from '@/lib/auth/roles';
import { loadQuote } from '@/lib/db/quotes';
import { findStyle } from '@/lib/db/styles';
import { idParamSchema } from '@/lib/validations/style';
import { QuoteSection } from '@/components/quote/quote-section';

export const metadata: Metadata = { title: 'Quote' };

export default async function StyleQuotePage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const parsed = idParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  // Costs are the studio's: the mill and the client see no quote page at all.
  if (!canSeeCosts(user.role)) notFound();
  if (!(await findStyle(user, parsed.data.id))) notFound();
  const quote = await loadQuote(user, parsed.data.id);
  return <QuoteSection styleId={parsed.data.id} initial={quote} editable={can(user.role, 'quote:edit')} />;
}
