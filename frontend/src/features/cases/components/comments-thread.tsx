import { useState } from 'react';
import { caseCommentCreate } from '@shared/schemas/cases';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { formatDateTime } from '@frontend/lib/format';
import { useAddComment } from '../api/add-comment';
import { useCaseComments } from '../api/get-comments';

/** The conversation about the case, oldest first, and a box to add to it for those who may. */
export function CommentsThread({ organisationId, caseId, canComment }: { organisationId: string; caseId: string; canComment: boolean }) {
  const comments = useCaseComments(organisationId, caseId);
  const add = useAddComment(organisationId, caseId);
  const [text, setText] = useState('');
  const [error, setError] = useState<string | undefined>();
  return (
    <section aria-labelledby="case-comments" className="flex flex-col gap-2 print:hidden">
      <h2 id="case-comments" className="text-base font-semibold">
        Comments
      </h2>
      {comments.isPending && <LoadingState what="the comments" />}
      {comments.isError && <ErrorState what="the comments" error={comments.error} onRetry={() => comments.refetch()} />}
      {comments.data?.length === 0 && <p className="text-sm text-ink-soft">No comments yet.</p>}
      <ol className="flex flex-col gap-2" data-testid="case-comments">
        {comments.data?.map((c) => (
          <li key={c.id} className="rounded border border-rule bg-paper-raised px-3 py-2">
            <p className="text-xs text-ink-soft">
              <span className="font-medium text-ink">{c.author.name}</span> · {formatDateTime(c.createdAt)}
            </p>
            <p className="mt-1 text-sm whitespace-pre-wrap">{c.text}</p>
          </li>
        ))}
      </ol>
      {canComment && (
        <form
          aria-label="Add a comment"
          className="flex flex-col gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            const checked = caseCommentCreate.safeParse({ text });
            if (!checked.success) return setError(checked.error.issues[0]?.message);
            setError(undefined);
            add.mutate(checked.data, { onSuccess: () => setText('') });
          }}
        >
          <label htmlFor="new-comment" className="sr-only">
            Comment
          </label>
          <textarea
            id="new-comment"
            rows={2}
            value={text}
            placeholder="Add a comment"
            aria-invalid={error ? true : undefined}
            onChange={(e) => setText(e.target.value)}
            className={`rounded border bg-paper-raised px-2.5 py-1.5 text-sm ${error ? 'border-fault' : 'border-rule'}`}
          />
          {error && <p className="text-xs text-fault">{error}</p>}
          {add.isError && <Notice tone="fault">{add.error.message}</Notice>}
          <Button type="submit" className="self-start" disabled={add.isPending}>
            {add.isPending ? 'Adding…' : 'Add comment'}
          </Button>
        </form>
      )}
    </section>
  );
}
