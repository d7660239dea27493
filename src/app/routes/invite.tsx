// /invite/:token — public: a person invited by the desk administrator sets a password
// from the one-time link in their e-mail and lands signed in on their own desk. An unknown
// or used link and an expired one each say what happened and who can send a new one.
import type { ReactNode } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { isApiError } from '@/lib/api-client';
import { homeFor } from '@/lib/auth';
import { formatDateTime } from '@/lib/format';
import { PlainLayout } from '@/components/layouts/plain-layout';
import { PageLoading } from '@/components/ui/page-loading';
import { useInvite } from '@/features/invites/api/invites';
import { AcceptInviteForm } from '@/features/invites/components/accept-invite-form';

function Sheet({ title, children }: { title: string; children: ReactNode }) {
  return (
    <div className="w-full max-w-[460px] border border-rule border-t-4 border-t-ink bg-sheet px-7 py-7 shadow-[0_1px_0_#d9d5cb,0_12px_32px_-18px_rgba(22,25,28,0.35)]">
      <p className="text-[11.5px] font-bold uppercase tracking-[0.14em] text-ink-soft">Invitation</p>
      <h1 className="mt-1 text-[24px] font-black leading-tight">{title}</h1>
      <div className="mt-3">{children}</div>
    </div>
  );
}

export default function InviteRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const invite = useInvite(token);

  let body: ReactNode;
  if (invite.isPending) {
    body = <PageLoading label="Opening your invitation" />;
  } else if (invite.isError) {
    const error = invite.error;
    if (isApiError(error) && error.status === 410) {
      body = (
        <Sheet title="This link expired">
          <p className="text-sm leading-relaxed">
            Invitation links work for a limited time and this one has run out. Ask the desk administrator who
            invited you to send a new link; it will arrive at the same e-mail address.
          </p>
        </Sheet>
      );
    } else if (isApiError(error) && error.status === 404) {
      body = (
        <Sheet title="This invitation link is not valid">
          <p className="text-sm leading-relaxed">
            The link may have been used already, replaced by a newer one, or copied only in part. If you have
            set your password,{' '}
            <Link to="/sign-in" className="font-bold text-verdigris underline">
              sign in
            </Link>
            ; otherwise ask your desk administrator for a new link.
          </p>
        </Sheet>
      );
    } else {
      body = (
        <Sheet title="The invitation could not be opened">
          <p className="text-sm leading-relaxed">{error.message}</p>
        </Sheet>
      );
    }
  } else {
    const info = invite.data;
    body = (
      <Sheet title={`Welcome, ${info.name}`}>
        <p className="text-sm leading-relaxed text-ink-soft">
          You have been invited to the Counterpoise lift review desk for{' '}
          <strong className="text-ink">{info.organisation}</strong>. Choose a password for{' '}
          <strong className="text-ink">{info.email}</strong>; you will be signed in straight away.
        </p>
        <p className="mt-2 text-[13px] text-ink-soft">
          This link works until <strong className="text-ink">{formatDateTime(info.expiresAt)}</strong> and
          only once.
        </p>
        <div className="mt-5">
          <AcceptInviteForm
            token={token}
            email={info.email}
            onAccepted={(user) => navigate(homeFor(user), { replace: true })}
          />
        </div>
      </Sheet>
    );
  }

  return <PlainLayout>{body}</PlainLayout>;
}
