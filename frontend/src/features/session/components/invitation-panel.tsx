import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { acceptInvitationRequest } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass } from '@frontend/components/ui/public-page';
import { ErrorState, LoadingState } from '@frontend/components/ui/query-state';
import { TextField } from '@frontend/components/ui/text-field';
import { formatDateTime, ROLE_LABELS, ROLE_NOTES } from '@frontend/lib/format';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { signInReturningTo } from '@frontend/lib/safe-next';
import { useAcceptInvitation } from '../api/accept-invitation';
import { useInvitationLink, type InvitationLinkView } from '../api/get-invitation-link';
import { useSession } from '../api/get-session';
import { useSignOut } from '../api/sign-out';
import { PASSWORD_RULE } from './password-rule';

/** What the invitation offers, then the one next step that fits who is (or is not) signed in. */
export function InvitationPanel({ token, onJoined }: { token: string; onJoined: () => void }) {
  const invitation = useInvitationLink(token);
  const session = useSession();
  if (invitation.isPending || session.isPending) return <LoadingState what="the invitation" />;
  if (invitation.isError) {
    return (
      <>
        <h1>Invitation</h1>
        <Notice tone="fault">{invitation.error.message}</Notice>
        <p className="text-sm text-ink-soft">Ask the administrator who invited you to send a new invitation. Links work once and expire after a week.</p>
      </>
    );
  }
  if (session.isError) return <ErrorState what="who is signed in" error={session.error} onRetry={() => session.refetch()} />;

  const inv = invitation.data;
  const user = session.data.user;
  const here = `/invitation?token=${encodeURIComponent(token)}`;
  return (
    <>
      <div>
        <h1>Join {inv.organisationName}</h1>
        <dl className="mt-3 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="text-ink-soft">Organisation</dt>
          <dd data-testid="invitation-organisation">{inv.organisationName}</dd>
          <dt className="text-ink-soft">Role</dt>
          <dd>
            {ROLE_LABELS[inv.role]} <span className="text-ink-faint">({ROLE_NOTES[inv.role]})</span>
          </dd>
          <dt className="text-ink-soft">For</dt>
          <dd>{inv.email}</dd>
          <dt className="text-ink-soft">Valid until</dt>
          <dd>{formatDateTime(inv.expiresAt)}</dd>
        </dl>
      </div>
      {user && user.email.toLowerCase() === inv.email.toLowerCase() ? (
        <JoinAsSignedIn token={token} onJoined={onJoined} />
      ) : user ? (
        <WrongPerson invitation={inv} signedInAs={user.email} signInHref={signInReturningTo(here)} />
      ) : inv.accountExists ? (
        <Notice>
          {inv.email} has a Cleancase account already.{' '}
          <Link className={linkClass} to={signInReturningTo(here)}>
            Sign in to accept
          </Link>
          ; you come back here afterwards.
        </Notice>
      ) : (
        <NewAccountForm token={token} email={inv.email} onJoined={onJoined} />
      )}
    </>
  );
}

function JoinAsSignedIn({ token, onJoined }: { token: string; onJoined: () => void }) {
  const accept = useAcceptInvitation(token);
  return (
    <>
      {accept.isError && <Notice tone="fault">{accept.error.message}</Notice>}
      <Button onClick={() => accept.mutate({}, { onSuccess: onJoined })} disabled={accept.isPending}>
        {accept.isPending ? 'Joining…' : 'Join'}
      </Button>
    </>
  );
}

function WrongPerson({ invitation, signedInAs, signInHref }: { invitation: InvitationLinkView; signedInAs: string; signInHref: string }) {
  const signOut = useSignOut();
  return (
    <>
      <Notice tone="warn">
        This invitation is for {invitation.email}, but you are signed in as {signedInAs}.{' '}
        {invitation.accountExists ? `Sign out, then sign in as ${invitation.email}.` : 'Sign out to accept it with a new account.'}
      </Notice>
      {signOut.isSuccess ? (
        invitation.accountExists && (
          <Link className={linkClass} to={signInHref}>
            Sign in as {invitation.email}
          </Link>
        )
      ) : (
        <Button variant="quiet" onClick={() => signOut.mutate()} disabled={signOut.isPending}>
          Sign out
        </Button>
      )}
    </>
  );
}

function NewAccountForm({ token, email, onJoined }: { token: string; email: string; onJoined: () => void }) {
  const accept = useAcceptInvitation(token);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const { name, password } = formText(event.currentTarget, 'name', 'password');
    const parsed = acceptInvitationRequest.safeParse({ name, password });
    const local: FieldErrors = parsed.success ? {} : zodFieldErrors(parsed.error);
    // The schema leaves both optional (signed-in people send neither); a new account needs both.
    if (!name.trim()) local.name ??= 'Enter your name';
    if (!password) local.password ??= 'Choose a password';
    if (!parsed.success || Object.keys(local).length) return setFieldErrors(local);
    setFieldErrors({});
    accept.mutate(parsed.data, { onSuccess: onJoined, onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };

  const message = formMessage(accept.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 border-t border-rule pt-4">
      <p className="text-sm text-ink-soft">Create your account for {email} to join.</p>
      <TextField label="Your name" name="name" autoComplete="name" error={fieldErrors.name} />
      <TextField label="Password" name="password" type="password" autoComplete="new-password" hint={PASSWORD_RULE} error={fieldErrors.password} />
      {message && (
        <p role="alert" className="text-sm text-fault">
          {message}
        </p>
      )}
      <Button type="submit" disabled={accept.isPending}>
        {accept.isPending ? 'Joining…' : 'Create account and join'}
      </Button>
    </form>
  );
}
