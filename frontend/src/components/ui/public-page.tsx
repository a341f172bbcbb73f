import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

/** The frame of the signed-out pages: the name, one card, and a footer. */
export function PublicPage({ children, footer, wide }: { children: ReactNode; footer?: ReactNode; wide?: boolean }) {
  return (
    <main className="flex min-h-screen flex-col items-center justify-center p-4">
      <div className={`w-full ${wide ? 'max-w-md' : 'max-w-sm'}`}>
        <Link to="/" className="mb-1 inline-block text-2xl font-semibold tracking-tight text-ink no-underline">
          Clean<span className="text-tube-600">case</span>
        </Link>
        <p className="mb-6 text-sm text-ink-soft">Condenser cleanliness, its cost, and when cleaning pays.</p>
        <div className="flex flex-col gap-4 rounded border border-rule bg-paper-raised p-5">{children}</div>
        {footer && <div className="mt-4 flex flex-wrap gap-x-4 gap-y-1 text-sm text-ink-soft">{footer}</div>}
      </div>
    </main>
  );
}

/** An in-text link in the accent colour, underlined so it reads as a link without colour. */
export const linkClass = 'text-tube-700 underline underline-offset-2 hover:text-tube-600';
