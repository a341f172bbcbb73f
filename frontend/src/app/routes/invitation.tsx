import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass, PublicPage } from '@frontend/components/ui/public-page';
import { InvitationPanel } from '@frontend/features/session/components/invitation-panel';

export function InvitationPage() {
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const token = params.get('token');
  return (
    <PublicPage
      wide
      footer={
        <Link className={linkClass} to="/">
          Go to Cleancase
        </Link>
      }
    >
      {token ? (
        <InvitationPanel token={token} onJoined={() => navigate('/')} />
      ) : (
        <>
          <h1>Invitation</h1>
          <Notice tone="fault">This address has no invitation code. Open the link from the invitation e-mail again.</Notice>
        </>
      )}
    </PublicPage>
  );
}
