import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { signInRequest } from '@shared/schemas/session';
import { Button } from '@frontend/components/ui/button';
import { TextField } from '@frontend/components/ui/text-field';
import { useSignIn } from '@frontend/features/session/api/sign-in';

export function SignInPage() {
  const navigate = useNavigate();
  const signIn = useSignIn();
  const [fieldErrors, setFieldErrors] = useState<Record<string, string>>({});

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    const parsed = signInRequest.safeParse({ email: String(form.get('email') ?? '').trim(), password: String(form.get('password') ?? '') });
    if (!parsed.success) {
      setFieldErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
      return;
    }
    setFieldErrors({});
    signIn.mutate(parsed.data, { onSuccess: () => navigate('/') });
  };

  return (
    <main className="flex min-h-screen items-center justify-center p-4">
      <div className="w-full max-w-sm">
        <p className="mb-1 text-2xl font-semibold tracking-tight">
          Clean<span className="text-tube-600">case</span>
        </p>
        <p className="mb-6 text-sm text-ink-soft">Condenser cleanliness, its cost, and when cleaning pays.</p>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4 rounded border border-rule bg-paper-raised p-5">
          <h1>Sign in</h1>
          <TextField label="E-mail" name="email" type="email" autoComplete="username" error={fieldErrors.email} />
          <TextField label="Password" name="password" type="password" autoComplete="current-password" error={fieldErrors.password} />
          {signIn.isError && (
            <p role="alert" className="text-sm text-fault">
              {signIn.error.message}
            </p>
          )}
          <Button type="submit" disabled={signIn.isPending}>
            {signIn.isPending ? 'Signing in…' : 'Sign in'}
          </Button>
        </form>
      </div>
    </main>
  );
}
