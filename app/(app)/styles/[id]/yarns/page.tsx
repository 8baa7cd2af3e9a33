import type { Metadata } from 'next';
import { notFound } from 'next/navigation';
import { loadYarnCalculatorSource } from '@/lib/db/yarn-calculator';
import { YarnCalculator } from '@/components/yarn-calculator/yarn-calculator';
import { workingCopyStyle } from '@/components/workspace/workspace-style';

export const metadata: Metadata = { title: 'Yarns & content' };

export default async function YarnsPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, style } = await workingCopyStyle((await params).id);
  const source = await loadYarnCalculatorSource(user, style.id);
  if (!source) notFound();
  return <YarnCalculator source={source} />;
}
