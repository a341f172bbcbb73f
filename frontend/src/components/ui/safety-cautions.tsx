/**
 * Safety cautions in a calm, visible box: not an alert (nothing went wrong), but never hidden. The first
 * text is the general caution that defers to local codes, the equipment maker and licensed practice.
 */
export function SafetyCautions({ texts, className = '', testId }: { texts: string[]; className?: string; testId?: string }) {
  if (texts.length === 0) return null;
  const [general, ...specific] = texts;
  return (
    <div className={`rounded border border-warn/40 bg-ledger-50 px-3 py-2 text-xs text-warn ${className}`} data-testid={testId}>
      <p>
        <strong className="font-semibold">Safety: </strong>
        {general}
      </p>
      {specific.length > 0 && (
        <ul className="mt-1.5 list-disc space-y-1 pl-5">
          {specific.map((t) => (
            <li key={t}>{t}</li>
          ))}
        </ul>
      )}
    </div>
  );
}
