import type { ReactNode } from 'react';

/** Says what is missing and what to do next. */
export function EmptyState({ title, next, children }: { title: string; next: string; children?: ReactNode }) {
  return (
    <div className="rounded border border-dashed border-rule bg-paper-raised p-6 text-center">
      <p className="font-medium">{title}</p>
      <p className="mt-1 text-sm text-ink-soft">{next}</p>
      {children && <div className="mt-4 flex justify-center">{children}</div>}
    </div>
  );
}
