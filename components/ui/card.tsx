export function Card({ title, actions, children, className = '' }: { title?: React.ReactNode; actions?: React.ReactNode; children: React.ReactNode; className?: string }) {
  return (
    <section className={`rounded-[var(--radius-card)] border border-rule bg-panel shadow-[0_1px_2px_rgba(31,36,40,0.04)] ${className}`}>
      {title || actions ? (
        <header className="flex items-center justify-between gap-3 border-b border-rule px-4 py-2.5">
          <h2 className="text-[13px] font-semibold tracking-tight text-ink">{title}</h2>
          <div className="flex items-center gap-2">{actions}</div>
        </header>
      ) : null}
      <div className="p-4">{children}</div>
    </section>
  );
}

export function PageHeader({ title, eyebrow, actions, children }: { title: React.ReactNode; eyebrow?: React.ReactNode; actions?: React.ReactNode; children?: React.ReactNode }) {
  return (
    <div className="mb-5 flex flex-wrap items-end justify-between gap-4">
      <div>
        {eyebrow ? <div className="mb-1 text-xs font-medium uppercase tracking-[0.08em] text-ink-faint">{eyebrow}</div> : null}
        <h1 className="text-[22px] font-semibold tracking-tight text-ink">{title}</h1>
        {children}
      </div>
      {actions ? <div className="flex items-center gap-2">{actions}</div> : null}
    </div>
  );
}

export function Notice({ tone = 'info', children }: { tone?: 'info' | 'warn' | 'error'; children: React.ReactNode }) {
  const tones = {
    info: 'border-spruce-100 bg-spruce-50 text-spruce-700',
    warn: 'border-ochre-500/30 bg-ochre-50 text-ochre-700',
    error: 'border-madder-500/30 bg-madder-50 text-madder-700',
  } as const;
  return <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md border px-3 py-2 text-sm ${tones[tone]}`}>{children}</div>;
}
