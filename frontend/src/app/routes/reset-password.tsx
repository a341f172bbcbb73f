import { Link, useSearchParams } from 'react-router-dom';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass, PublicPage } from '@frontend/components/ui/public-page';
import { ResetPasswordForm } from '@frontend/features/session/components/reset-password-form';

export function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <PublicPage
      footer={
        <Link className={linkClass} to="/sign-in">
          Back to sign-in
        </Link>
      }
    >
      {token ? (
        <ResetPasswordForm token={token} />
      ) : (
        <>
          <h1>Choose a new password</h1>
          <Notice tone="fault">This address has no reset code. Open the link from the e-mail again, or ask for a new one.</Notice>
          <Link className={linkClass} to="/forgot-password">
            Ask for a reset link
          </Link>
        </>
      )}
    </PublicPage>
  );
}
