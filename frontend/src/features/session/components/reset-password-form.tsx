import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { passwordResetConfirm } from '@shared/schemas/accounts';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { linkClass } from '@frontend/components/ui/public-page';
import { TextField } from '@frontend/components/ui/text-field';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';
import { PASSWORD_RULE } from './password-rule';

export function ResetPasswordForm({ token }: { token: string }) {
  const confirm = useConfirmPasswordReset();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});

  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const { password } = formText(event.currentTarget, 'password');
    const parsed = passwordResetConfirm.safeParse({ token, password });
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    confirm.mutate(parsed.data, { onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };

  if (confirm.isSuccess) {
    return (
      <>
        <h1>Password changed</h1>
        <Notice tone="ok">Your password is changed and every session of your account has ended.</Notice>
        <Link to="/sign-in" className={linkClass}>
          Sign in with your new password
        </Link>
      </>
    );
  }
  const message = formMessage(confirm.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <div>
        <h1>Choose a new password</h1>
        <p className="mt-1 text-sm text-ink-soft">Every session of your account ends when you save it, on every device.</p>
      </div>
      <TextField label="New password" name="password" type="password" autoComplete="new-password" hint={PASSWORD_RULE} error={fieldErrors.password} />
      {fieldErrors.token && <Notice tone="fault">This reset link is incomplete. Open it again from the e-mail, or ask for a new one.</Notice>}
      {message && (
        <p role="alert" className="text-sm text-fault">
          {message}{' '}
          <Link to="/forgot-password" className={linkClass}>
            Ask for a new link
          </Link>
        </p>
      )}
      <Button type="submit" disabled={confirm.isPending}>
        {confirm.isPending ? 'Saving…' : 'Save the new password'}
      </Button>
    </form>
  );
}
