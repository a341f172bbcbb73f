import { Link, useSearchParams } from 'react-router-dom';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass, PublicPage } from '@frontend/components/ui/public-page';
import { useConfirmAddress } from '@frontend/features/session/api/confirm-address';
import { formMessage } from '@frontend/lib/form-errors';

/** The page the confirmation link opens: one button, so a mail scanner fetching the link confirms nothing. */
export function ConfirmAddressPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const confirm = useConfirmAddress();
  const message = formMessage(confirm.error);
  return (
    <PublicPage
      footer={
        <Link className={linkClass} to="/sign-in">
          Back to sign-in
        </Link>
      }
    >
      <h1>Confirm your e-mail address</h1>
      {!token ? (
        <Notice tone="fault">This address has no confirmation code. Open the link from the e-mail again.</Notice>
      ) : confirm.isSuccess ? (
        <>
          <Notice tone="ok">Your address is confirmed. Mail sent to it from now on shows in the local mailbox of a local run.</Notice>
          <Link to="/sign-in" className={linkClass}>
            Sign in
          </Link>
        </>
      ) : (
        <>
          <p className="text-sm text-ink-soft">Confirming shows that this e-mail address is yours.</p>
          {message && (
            <p role="alert" className="text-sm text-fault">
              {message}{' '}
              <Link to="/forgot-password" className={linkClass}>
                Ask for a reset link
              </Link>
            </p>
          )}
          <Button type="button" disabled={confirm.isPending} onClick={() => confirm.mutate({ token })}>
            {confirm.isPending ? 'Confirming…' : 'Confirm this address'}
          </Button>
        </>
      )}
    </PublicPage>
  );
}
