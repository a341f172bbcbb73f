import { Link, useNavigate } from 'react-router-dom';
import { linkClass, PublicPage } from '@frontend/components/ui/public-page';
import { SignUpForm } from '@frontend/features/session/components/sign-up-form';

export function SignUpPage() {
  const navigate = useNavigate();
  return (
    <PublicPage
      footer={
        <span>
          Have an account already?{' '}
          <Link className={linkClass} to="/sign-in">
            Sign in
          </Link>
        </span>
      }
    >
      <SignUpForm onSignedUp={() => navigate('/')} />
    </PublicPage>
  );
}
