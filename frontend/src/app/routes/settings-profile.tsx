import { LoadingState } from '@frontend/components/ui/query-state';
import { useSession } from '@frontend/features/session/api/get-session';
import { PasswordChangeForm, ProfileForm } from '@frontend/features/session/components/profile-forms';

export function ProfileSettingsPage() {
  const { data: session } = useSession();
  if (!session?.user) return <LoadingState what="your profile" />;
  return (
    <section className="flex flex-col gap-8">
      <div>
        <h1>Your profile</h1>
        <p className="mt-1 text-sm text-ink-soft">How your name appears to colleagues, and the units every number is shown in.</p>
      </div>
      <ProfileForm key={session.user.id} user={session.user} />
      <hr className="border-rule" />
      <PasswordChangeForm email={session.user.email} />
    </section>
  );
}
