import type { ReactNode } from 'react';

type Tone = 'info' | 'ok' | 'warn' | 'fault';

const tones: Record<Tone, string> = {
  info: 'border-tube-100 bg-tube-50 text-tube-700',
  ok: 'border-ok/30 bg-paper-raised text-ok',
  warn: 'border-warn/40 bg-ledger-50 text-warn',
  fault: 'border-fault/40 bg-paper-raised text-fault',
};

/** A short message in a box; faults and warnings are announced at once. */
export function Notice({ tone = 'info', children, className = '' }: { tone?: Tone; children: ReactNode; className?: string }) {
  return (
    <div role={tone === 'fault' || tone === 'warn' ? 'alert' : 'status'} className={`rounded border px-3 py-2 text-sm ${tones[tone]} ${className}`}>
      {children}
    </div>
  );
}
