import { forwardRef, useId } from 'react';

const control =
  'block rounded-md border border-rule-strong bg-panel px-2.5 py-1.5 text-sm text-ink shadow-xs placeholder:text-ink-faint focus:border-spruce-500 focus:outline-none focus:ring-2 focus:ring-spruce-100 aria-[invalid=true]:border-madder-500';

/** Full width unless the caller sets a width or max-width. */
const widthOf = (className: string) => (/(^|\s)(w-|max-w-)/.test(className) ? (/(^|\s)max-w-/.test(className) ? 'w-full' : '') : 'w-full');

/** A labelled field with its error beside it. The label is bound to the control for screen readers and tests. */
export function Field({ label, error, hint, children, className = '' }: { label: string; error?: string; hint?: string; children: (id: string) => React.ReactNode; className?: string }) {
  const id = useId();
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={id} className="block text-xs font-medium text-ink-soft">{label}</label>
      {children(id)}
      {error ? <p role="alert" className="text-xs text-madder-700">{error}</p> : hint ? <p className="text-xs text-ink-faint">{hint}</p> : null}
    </div>
  );
}

export const Input = forwardRef<HTMLInputElement, React.InputHTMLAttributes<HTMLInputElement>>(function Input({ className = '', ...props }, ref) {
  return <input ref={ref} className={`${control} ${widthOf(className)} h-9 ${className}`} {...props} />;
});

export const Select = forwardRef<HTMLSelectElement, React.SelectHTMLAttributes<HTMLSelectElement>>(function Select({ className = '', ...props }, ref) {
  return <select ref={ref} className={`${control} ${widthOf(className)} h-9 pr-8 ${className}`} {...props} />;
});
