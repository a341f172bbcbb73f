import { useState, type FormEvent } from 'react';
import { signUpRequest } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { TextField } from '@frontend/components/ui/text-field';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useSignUp } from '../api/sign-up';
import { PASSWORD_RULE } from './password-rule';

export function SignUpForm({ onSignedUp }: { onSignedUp: () => void }) {
  const signUp = useSignUp();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = signUpRequest.safeParse(formText(event.currentTarget, 'name', 'email', 'password', 'organisationName'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    signUp.mutate(parsed.data, { onSuccess: onSignedUp, onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };

  const message = formMessage(signUp.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div>
        <h1>Create an account</h1>
        <p className="mt-1 text-sm text-ink-soft">Your organisation starts on a free 14-day trial. You become its administrator and can invite colleagues.</p>
      </div>
      <TextField label="Your name" name="name" autoComplete="name" error={fieldErrors.name} />
      <TextField label="Work e-mail" name="email" type="email" autoComplete="email" error={fieldErrors.email} />
      <TextField label="Password" name="password" type="password" autoComplete="new-password" hint={PASSWORD_RULE} error={fieldErrors.password} />
      <TextField
        label="Organisation name"
        name="organisationName"
        autoComplete="organization"
        hint="The utility, plant owner or consultancy you work for."
        error={fieldErrors.organisationName}
      />
      {message && (
        <p role="alert" className="text-sm text-fault">
          {message}
        </p>
      )}
      <Button type="submit" disabled={signUp.isPending}>
        {signUp.isPending ? 'Creating…' : 'Create account and start trial'}
      </Button>
    </form>
  );
}
