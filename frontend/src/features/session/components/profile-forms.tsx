import { useState, type FormEvent } from 'react';
import { passwordChange, profileUpdate } from '@shared/schemas/accounts';
import type { SessionResponse } from '@shared/schemas/session';
import { Button } from '@frontend/components/ui/button';
import { Notice } from '@frontend/components/ui/notice';
import { TextField } from '@frontend/components/ui/text-field';
import { formMessage, formText, serverFieldErrors, zodFieldErrors, type FieldErrors } from '@frontend/lib/form-errors';
import { useChangePassword } from '../api/change-password';
import { useUpdateProfile } from '../api/update-profile';
import { PASSWORD_RULE } from './password-rule';

type User = NonNullable<SessionResponse['user']>;

export function ProfileForm({ user }: { user: User }) {
  const update = useUpdateProfile();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const parsed = profileUpdate.safeParse(formText(event.currentTarget, 'name', 'unitPreference'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    update.mutate(parsed.data, { onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };
  const message = formMessage(update.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-md flex-col gap-4" onChange={() => update.isSuccess && update.reset()}>
      <h2>Name and units</h2>
      <TextField label="Name" name="name" autoComplete="name" defaultValue={user.name} error={fieldErrors.name} />
      <p className="-mt-2 text-xs text-ink-faint">Sign-in e-mail: {user.email}</p>
      <fieldset className="flex flex-col gap-1.5">
        <legend className="mb-1 text-sm font-medium">Units for numbers</legend>
        <label className="flex items-center gap-2 text-sm">
          <input type="radio" name="unitPreference" value="us" defaultChecked={user.unitPreference === 'us'} />
          US customary <span className="text-ink-faint">(inHg, °F, Btu/kWh)</span>
        </label>
        <label className="flex items-center gap-2 text-sm">
          <input type="radio" name="unitPreference" value="si" defaultChecked={user.unitPreference === 'si'} />
          SI <span className="text-ink-faint">(kPa, °C, kJ/kWh)</span>
        </label>
        {fieldErrors.unitPreference && <p className="text-xs text-fault">{fieldErrors.unitPreference}</p>}
      </fieldset>
      {message && <Notice tone="fault">{message}</Notice>}
      {update.isSuccess && <Notice tone="ok">Saved.</Notice>}
      <div>
        <Button type="submit" disabled={update.isPending}>
          {update.isPending ? 'Saving…' : 'Save'}
        </Button>
      </div>
    </form>
  );
}

export function PasswordChangeForm({ email }: { email: string }) {
  const change = useChangePassword();
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const form = event.currentTarget;
    const parsed = passwordChange.safeParse(formText(form, 'currentPassword', 'newPassword'));
    if (!parsed.success) return setFieldErrors(zodFieldErrors(parsed.error));
    setFieldErrors({});
    change.mutate(parsed.data, { onSuccess: () => form.reset(), onError: (e) => setFieldErrors(serverFieldErrors(e)) });
  };
  const message = formMessage(change.error);
  return (
    <form onSubmit={onSubmit} noValidate className="flex max-w-md flex-col gap-4">
      <div>
        <h2>Password</h2>
        <p className="mt-1 text-sm text-ink-soft">Changing it signs you out everywhere else (other browsers and devices); you stay signed in here.</p>
      </div>
      {/* Lets password managers pair the new password with the account. */}
      <input type="email" name="username" autoComplete="username" value={email} readOnly hidden />
      <TextField label="Current password" name="currentPassword" type="password" autoComplete="current-password" error={fieldErrors.currentPassword} />
      <TextField label="New password" name="newPassword" type="password" autoComplete="new-password" hint={PASSWORD_RULE} error={fieldErrors.newPassword} />
      {message && <Notice tone="fault">{message}</Notice>}
      {change.isSuccess && <Notice tone="ok">Password changed. Other sessions have been signed out.</Notice>}
      <div>
        <Button type="submit" disabled={change.isPending}>
          {change.isPending ? 'Changing…' : 'Change password'}
        </Button>
      </div>
    </form>
  );
}
