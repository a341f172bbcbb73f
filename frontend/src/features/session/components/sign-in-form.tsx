import { useState, type FormEvent } from 'react';
import { signInRequest } from '@shared/schemas/session';
import { Button } from '@frontend/components/ui/button';
import { TextField } from '@frontend/components/ui/text-field';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useSignIn } from '../api/sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const { email, password } = formText(event.currentTarget, 'email', 'password');
    const parsed = signInRequest.safeParse({ email: email.trim(), password });
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    signIn.mutate(parsed.data, { onSuccess: onSignedIn, onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };

  const message = formMessage(signIn.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <h1>Sign in</h1>
      <TextField label="E-mail" name="email" type="email" autoComplete="username" error={fieldErrors.email} />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" error={fieldErrors.password} />
      {message && (
        <p role="alert" className="text-sm text-fault">
          {message}
        </p>
      )}
      <Button type="submit" disabled={signIn.isPending}>
        {signIn.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
