/** A determinate progress bar with what is happening said in words beside it. */
export function ProgressBar({ fraction, label, message }: { fraction: number; label: string; message?: string | null }) {
  const pct = Math.round(Math.max(0, Math.min(1, fraction)) * 100);
  return (
    <div className="flex flex-col gap-1" role="group" aria-label={label}>
      <div className="flex justify-between gap-4 text-sm">
        <span className="text-ink-soft">{message ?? label}</span>
        <span className="tabular-nums text-ink-soft">{pct} %</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        className="h-2 overflow-hidden rounded bg-paper-sunk"
      >
        <div className="h-full bg-tube-500 transition-[width] duration-300" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}
