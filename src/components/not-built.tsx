import type { ReactNode } from 'react';

/** An honest placeholder for a section that is planned but not built yet. */
export function NotBuiltYet({ title, willShow, meanwhile }: { title: string; willShow: ReactNode; meanwhile?: ReactNode }) {
  return (
    <section className="rounded-lg border border-ink-200 bg-white p-5">
      <h2 className="text-lg font-semibold text-ink-900">{title}</h2>
      <p className="mt-1 inline-block rounded bg-ink-100 px-2 py-0.5 text-xs font-medium text-ink-700">Not built yet</p>
      <div className="mt-3 max-w-prose space-y-2 text-sm text-ink-700">{willShow}</div>
      {meanwhile && <div className="mt-4 max-w-prose border-t border-ink-100 pt-3 text-sm text-ink-700">{meanwhile}</div>}
    </section>
  );
}
