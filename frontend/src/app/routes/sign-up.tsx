import { Link, useNavigate } from 'react-router-dom';
import { linkClass, PublicPage } from '@frontend/components/ui/public-page';
import { SignUpForm } from '@frontend/features/session/components/sign-up-form';

export function SignUpPage() {
  const navigate = useNavigate();
  return (
    <PublicPage
      footer={
        <>
          Have an account already?{' '}
          <Link className={linkClass} to="/sign-in">
            Sign in
          </Link>
        </>
      }
    >
      <SignUpForm onSignedUp={() => navigate('/')} />
    </PublicPage>
  );
}
