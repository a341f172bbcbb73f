import { Link } from 'react-router-dom';
import { EmptyState } from '@frontend/components/ui/empty-state';
import { linkClass } from '@frontend/components/ui/public-page';
import { LoadingState } from '@frontend/components/ui/query-state';
import { MailboxList } from '@frontend/features/dev-mailbox/components/mailbox-list';
import { useSession } from '@frontend/features/session/api/get-session';

/**
 * Each signed-in person reads the mail addressed to them. Someone who cannot sign in (a new invitee, a forgotten
 * password) follows the link printed in the terminal where the server runs.
 */
export function MailboxPage() {
  const session = useSession();
  return (
    <main className="mx-auto flex max-w-3xl flex-col gap-4 px-gutter py-6">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <div>
          <Link to="/" className="text-base font-semibold tracking-tight text-ink">
            Clean<span className="text-tube-600">case</span>
          </Link>
          <h1 className="mt-2">Local mailbox</h1>
          <p className="mt-1 text-sm text-ink-soft">Mail this local server sent to you. Nothing here left the machine.</p>
        </div>
        <Link className={`${linkClass} text-sm`} to={session.data?.user ? '/' : '/sign-in?next=%2Fmailbox'}>
          {session.data?.user ? 'Back to the overview' : 'Back to sign-in'}
        </Link>
      </div>
      {session.isPending ? (
        <LoadingState what="the mailbox" />
      ) : !session.data?.devMailbox ? (
        <EmptyState title="No local mailbox on this server" next="This server sends real e-mail; look in your own inbox." />
      ) : session.data.user ? (
        <MailboxList />
      ) : (
        <EmptyState
          title="Sign in to read your mail"
          next="The mailbox shows each person only the mail sent to them. Cannot sign in? Every message is also printed in the terminal where the server runs; follow the link there."
        />
      )}
    </main>
  );
}
