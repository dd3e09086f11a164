import type { ReactNode } from 'react';
import { cn } from './cn';

/** A screen or panel with nothing in it yet: what it is for and what to do next. */
export function EmptyState({ title, children, action, className }: { title: string; children?: ReactNode; action?: ReactNode; className?: string }) {
  return (
    <section className={cn('rounded-lg border border-dashed border-ink-300 bg-white px-5 py-8 text-center', className)}>
      <h2 className="text-base font-semibold text-ink-900">{title}</h2>
      {children && <div className="mx-auto mt-2 max-w-prose space-y-2 text-sm text-ink-600">{children}</div>}
      {action && <div className="mt-4 flex justify-center">{action}</div>}
    </section>
  );
}

/** A loading line for a panel ("Loading lines…"). */
export function Loading({ label, className }: { label: string; className?: string }) {
  return (
    <div role="status" className={cn('flex items-center gap-3 px-1 py-6 text-sm text-ink-600', className)}>
      <span aria-hidden className="size-5 animate-spin rounded-full border-2 border-brand-500 border-t-transparent" />
      {label}
    </div>
  );
}

/** A white panel with an optional heading row. */
export function Panel({ title, actions, children, className, headingLevel = 2 }: { title?: ReactNode; actions?: ReactNode; children: ReactNode; className?: string; headingLevel?: 2 | 3 }) {
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section className={cn('rounded-lg border border-ink-200 bg-white', className)}>
      {(title || actions) && (
        <div className="flex flex-wrap items-center justify-between gap-2 border-b border-ink-200 px-4 py-3">
          {title && <Heading className="text-base font-semibold text-ink-900">{title}</Heading>}
          {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
        </div>
      )}
      <div className="p-4">{children}</div>
    </section>
  );
}

/** A small rounded label. */
export function Badge({ children, className, title }: { children: ReactNode; className?: string; title?: string }) {
  return (
    <span title={title} className={cn('inline-flex items-center rounded-full px-2 py-0.5 text-xs font-medium whitespace-nowrap', className ?? 'bg-ink-100 text-ink-700')}>
      {children}
    </span>
  );
}
