import type { ReactNode } from 'react';

/** A chart or table of the case with its title, what it shows, and a note on how it was made. */
export function CaseFigure({
  title,
  what,
  note,
  children,
  testId,
  updating,
}: {
  title: string;
  what?: ReactNode;
  note?: ReactNode;
  children: ReactNode;
  testId: string;
  updating?: boolean;
}) {
  return (
    <figure
      className="case-figure flex min-w-0 flex-col gap-2 rounded border border-rule bg-paper-raised p-3"
      data-testid={testId}
      aria-busy={updating || undefined}
    >
      <figcaption className="flex flex-col gap-0.5">
        <h3 className="flex items-center gap-2 text-sm font-semibold">
          {title}
          {updating && <span className="animate-pulse text-xs font-normal text-ink-faint print:hidden">updating…</span>}
        </h3>
        {what && <p className="text-xs text-ink-soft">{what}</p>}
      </figcaption>
      <div className={updating ? 'opacity-50 transition-opacity' : ''}>{children}</div>
      {note && <p className="text-2xs text-ink-faint">{note}</p>}
    </figure>
  );
}

export function Swatch({ colour, label, dashed }: { colour: string; label: string; dashed?: boolean }) {
  return (
    <span className="inline-flex items-center gap-1.5 text-xs">
      <svg width="18" height="10" aria-hidden>
        {dashed ? (
          <line x1="1" x2="17" y1="5" y2="5" stroke={colour} strokeWidth="2" strokeDasharray="4 3" />
        ) : (
          <rect x="1" y="0" width="16" height="10" fill={colour} />
        )}
      </svg>
      {label}
    </span>
  );
}
