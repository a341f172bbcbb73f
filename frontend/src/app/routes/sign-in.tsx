import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass, PublicPage } from '@frontend/components/ui/public-page';
import { useSession } from '@frontend/features/session/api/get-session';
import { SignInForm } from '@frontend/features/session/components/sign-in-form';
import { safeNextPath } from '@frontend/lib/safe-next';

export function SignInPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const { data: session } = useSession();
  const next = safeNextPath(params.get('next'));
  const googleFailed = params.get('google') === 'failed';

  return (
    <PublicPage
      footer={
        <>
          <Link className={linkClass} to="/sign-up">
            Create an account
          </Link>
          <Link className={linkClass} to="/forgot-password">
            Forgot your password?
          </Link>
          {session?.devMailbox && (
            <Link className={`${linkClass} ml-auto`} to="/mailbox">
              Local mailbox
            </Link>
          )}
        </>
      }
    >
      {googleFailed && <Notice tone="fault">Signing in with Google did not work. Try again, or use your e-mail and password.</Notice>}
      {next && <p className="text-sm text-ink-soft">Sign in to continue; you go back to where you were afterwards.</p>}
      <SignInForm onSignedIn={() => navigate(next ?? '/')} />
      <div className="flex items-center gap-3 text-xs text-ink-faint" aria-hidden>
        <span className="h-px flex-1 bg-rule" />
        or
        <span className="h-px flex-1 bg-rule" />
      </div>
      {/* A plain link: the server redirects to Google (or its local stand-in) and back. */}
      <a
        href="/api/auth/google"
        className="inline-flex items-center justify-center gap-2 rounded border border-rule bg-paper-raised px-3 py-1.5 text-sm font-medium text-ink hover:bg-paper-sunk"
      >
        <span aria-hidden className="font-bold text-tube-600">
          G
        </span>
        Sign in with Google
      </a>
    </PublicPage>
  );
}
