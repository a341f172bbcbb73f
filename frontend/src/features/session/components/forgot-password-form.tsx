import { useState, type FormEvent } from 'react';
import { passwordResetRequest } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { TextField } from '@frontend/components/ui/text-field';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useRequestPasswordReset } from '../api/request-password-reset';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = passwordResetRequest.safeParse(formText(event.currentTarget, 'email'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    request.mutate(parsed.data, { onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };

  if (request.isSuccess) {
    return (
      <>
        <h1>Check your e-mail</h1>
        <Notice tone="ok">{request.data.message}</Notice>
        <p className="text-sm text-ink-soft">
          The link works once and for a limited time. Nothing arrived after a few minutes? Look in the spam folder, then ask again.
        </p>
      </>
    );
  }
  const message = formMessage(request.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div>
        <h1>Forgot your password?</h1>
        <p className="mt-1 text-sm text-ink-soft">Enter the e-mail you sign in with. We send a link to choose a new password.</p>
      </div>
      <TextField label="E-mail" name="email" type="email" autoComplete="username" error={fieldErrors.email} />
      {message && (
        <p role="alert" className="text-sm text-fault">
          {message}
        </p>
      )}
      <Button type="submit" disabled={request.isPending}>
        {request.isPending ? 'Sending…' : 'Send the reset link'}
      </Button>
    </form>
  );
}
