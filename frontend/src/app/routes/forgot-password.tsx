import { Link } from 'react-router-dom';
import { linkClass, PublicPage } from '@frontend/components/ui/public-page';
import { useSession } from '@frontend/features/session/api/get-session';
import { ForgotPasswordForm } from '@frontend/features/session/components/forgot-password-form';

export function ForgotPasswordPage() {
  const { data: session } = useSession();
  return (
    <PublicPage
      footer={
        <>
          <Link className={linkClass} to="/sign-in">
            Back to sign-in
          </Link>
          {session?.devMailbox && (
            <Link className={`${linkClass} ml-auto`} to="/mailbox">
              Local mailbox
            </Link>
          )}
        </>
      }
    >
      <ForgotPasswordForm />
    </PublicPage>
  );
}
