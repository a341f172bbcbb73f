import { Fragment } from 'react';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { formatDateTime } from '@frontend/lib/format';
import { useMailbox } from '../api/get-mailbox';

/** Mail the app sent to the local SMTP sink, newest first, with the links clickable. */
export function MailboxList() {
  const mailbox = useMailbox();
  if (mailbox.isPending) return <LoadingState what="the mailbox" />;
  if (mailbox.isError) return <ErrorState what="the mailbox" error={mailbox.error} onRetry={() => mailbox.refetch()} />;
  if (!mailbox.data.addressConfirmed) {
    return (
      <EmptyState
        title="Your mailbox opens once your address is confirmed"
        next="Follow the confirmation link we mailed you after sign-up (a password reset link confirms the address too). In a local run every message, that link included, is printed in the terminal where Cleancase runs. Only mail that arrives after the confirmation shows here."
      />
    );
  }
  if (mailbox.data.messages.length === 0) {
    return <EmptyState title="No mail yet" next="Invite someone or ask for a password reset; the message shows up here within a few seconds." />;
  }
  return (
    <ol className="flex flex-col gap-3" aria-label="Messages, newest first">
      {mailbox.data.messages.map((m) => (
        <li key={m.id} className="rounded border border-rule bg-paper-raised" data-testid="mailbox-message">
          <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1 border-b border-rule bg-paper-sunk px-4 py-2">
            <h2 className="text-sm font-semibold">{m.subject || '(no subject)'}</h2>
            <p className="text-xs text-ink-soft">
              to {m.to.join(', ')} · <time dateTime={m.receivedAt}>{formatDateTime(m.receivedAt)}</time>
            </p>
          </div>
          <p className="whitespace-pre-wrap break-words px-4 py-3 text-sm">
            <LinkifiedText text={m.text} />
          </p>
        </li>
      ))}
    </ol>
  );
}

const URL_PATTERN = /(https?:\/\/[^\s<>"]+)/g;

/** Plain text with http(s) addresses turned into links; nothing else is interpreted. */
function LinkifiedText({ text }: { text: string }) {
  const parts = text.split(URL_PATTERN);
  return (
    <>
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a key={i} href={part} className="break-all text-tube-700 underline underline-offset-2 hover:text-tube-600">
            {part}
          </a>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </>
  );
}
