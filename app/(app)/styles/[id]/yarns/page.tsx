import type { Metadata } from 'next';
import { notFound, redirect } from 'next/navigation';
import { currentUser } from '@/lib/auth/authorize';
import { loadYarnCalculatorSource } from '@/lib/db/yarn-calculator';
import { idParamSchema } from '@/lib/validations/style';
import { YarnCalculator } from '@/components/yarn-calculator/yarn-calculator';

export const metadata: Metadata = { title: 'Yarns & content' };

export default async function YarnsPage({ params }: { params: Promise<{ id: string }> }) {
  const user = await currentUser();
  if (!user) redirect('/sign-in');
  const parsed = idParamSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const source = await loadYarnCalculatorSource(user, parsed.data.id);
  if (!source) notFound();
  return <YarnCalculator source={source} />;
}
