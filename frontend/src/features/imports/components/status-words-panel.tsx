import { useState } from 'react';
import { whyNot } from '@shared/permissions';
import { statusWordsBody } from '@shared/schemas/historian-status';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { useSaveStatusWords, useStatusWords } from '../api/historian-status-words';

/**
 * The status words a historian writes instead of a value: a cell holding exactly one of them is a missing reading,
 * kept out as "instrument status", not a wrong file. Administrators add their own historian's words here.
 */
export function StatusWordsPanel({ organisationId }: { organisationId: string }) {
  const words = useStatusWords(organisationId);
  const save = useSaveStatusWords(organisationId);
  const [draft, setDraft] = useState<string | null>(null);
  const mayEdit = !!words.data?.mayEdit;
  const own = words.data?.words ?? [];
  const text = draft ?? own.join('\n');
  const list = text
    .split(/\r?\n/)
    .map((w) => w.trim())
    .filter(Boolean);
  const checked = statusWordsBody.safeParse({ words: list });
  const problems = checked.success ? [] : [...new Set(checked.error.issues.map((i) => i.message))];

  return (
    <fieldset className="flex flex-col gap-2" data-testid="status-words">
      <legend className="mb-1 text-sm font-semibold">Status words in number cells</legend>
      <p className="text-sm text-ink-soft">
        A cell holding only one of these words (any case) is a reading the historian marked as missing: the row is kept, left out of the calculations as
        instrument status and counted per word. Any other text in a number cell makes the file wrong.
      </p>
      <p className="text-sm">
        <span className="text-ink-soft">Always: </span>
        {(words.data?.defaults ?? []).join(', ')}
        {own.length > 0 && (
          <>
            <span className="text-ink-soft">; your organisation’s: </span>
            {own.join(', ')}
          </>
        )}
      </p>
      {mayEdit ? (
        <details>
          <summary className="cursor-pointer text-sm">Words of your own historian</summary>
          <div className="mt-2 flex flex-col gap-2">
            <label className="flex flex-col gap-1 text-sm">
              One word or phrase a line (at most 40)
              <textarea
                rows={4}
                value={text}
                onChange={(e) => setDraft(e.target.value)}
                className="max-w-md rounded border border-rule bg-paper-raised px-2 py-1 font-mono text-sm"
              />
            </label>
            {problems.length > 0 && <Notice tone="warn">{problems.join('; ')}</Notice>}
            {save.isError && <Notice tone="fault">{save.error.message}</Notice>}
            <div>
              <Button
                variant="quiet"
                disabled={!checked.success || save.isPending || draft === null}
                onClick={() => save.mutate(list, { onSuccess: () => setDraft(null) })}
              >
                {save.isPending ? 'Saving…' : 'Save the words'}
              </Button>
            </div>
          </div>
        </details>
      ) : (
        <p className="text-xs text-ink-soft">Words of your own historian: {whyNot('members.manage')}.</p>
      )}
    </fieldset>
  );
}
