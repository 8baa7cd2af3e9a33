import { forwardRef } from 'react';

type Variant = 'primary' | 'secondary' | 'ghost' | 'danger';
const variants: Record<Variant, string> = {
  primary: 'bg-spruce-600 text-white hover:bg-spruce-700 border border-spruce-700 shadow-sm',
  secondary: 'bg-panel text-ink border border-rule-strong hover:bg-paper shadow-sm',
  ghost: 'text-ink-soft hover:bg-rule/60 border border-transparent',
  danger: 'bg-panel text-madder-700 border border-madder-500/40 hover:bg-madder-50',
};

export const Button = forwardRef<
  HTMLButtonElement,
  React.ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; size?: 'sm' | 'md' }
>(function Button({ variant = 'secondary', size = 'md', className = '', ...props }, ref) {
  const sz = size === 'sm' ? 'h-7 px-2.5 text-xs' : 'h-9 px-3.5 text-sm';
  return (
    <button
      ref={ref}
      className={`inline-flex items-center justify-center gap-1.5 rounded-md font-medium transition-colors disabled:cursor-not-allowed disabled:opacity-50 ${sz} ${variants[variant]} ${className}`}
      {...props}
    />
  );
});

export function ButtonLink({ href, children, variant = 'secondary', className = '' }: { href: string; children: React.ReactNode; variant?: Variant; className?: string }) {
  return (
    <a href={href} className={`inline-flex h-9 items-center justify-center gap-1.5 rounded-md px-3.5 text-sm font-medium transition-colors ${variants[variant]} ${className}`}>
      {children}
    </a>
  );
}
