// /profile — every signed-in person: their name, units, reminder choice and password.
import { useCurrentUser } from '@/lib/auth';
import { ROLE_LABELS } from '@/lib/roles';
import { PageHeader } from '@/components/layouts/page-header';
import { PageLoading } from '@/components/ui/page-loading';
import { ErrorPanel } from '@/components/ui/panel-message';
import { useProfile } from '@/features/profile/api/profile';
import { ProfileSettingsForm } from '@/features/profile/components/profile-form';
import { PasswordChangeForm } from '@/features/profile/components/password-form';

export default function ProfileRoute() {
  const { data: user } = useCurrentUser();
  const profile = useProfile();
  if (!user) return null;

  return (
    <>
      <PageHeader title="Profile" context={`${ROLE_LABELS[user.role]} · ${user.organisation.name}`} />
      {profile.isPending ? (
        <PageLoading label="Loading your profile" />
      ) : profile.isError ? (
        <ErrorPanel title="Your profile could not be loaded" message={profile.error.message} />
      ) : (
        <div className="grid max-w-[980px] grid-cols-1 gap-5 lg:grid-cols-[1.25fr_1fr]">
          <section aria-labelledby="settings-heading" className="border border-rule bg-sheet px-5 py-4">
            <h2 id="settings-heading" className="mb-3 text-base font-bold">
              Settings
            </h2>
            <ProfileSettingsForm profile={profile.data} />
          </section>
          <section
            aria-labelledby="password-heading"
            className="self-start border border-rule bg-sheet px-5 py-4"
          >
            <h2 id="password-heading" className="mb-3 text-base font-bold">
              Password
            </h2>
            <PasswordChangeForm email={profile.data.email} />
          </section>
        </div>
      )}
    </>
  );
}
