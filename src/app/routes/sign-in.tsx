// /sign-in: the form, and a plain word on who issues accounts. A signed-in person is
// sent on to ?next= (same-site paths only) or to their role's home.
import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { homeFor, safeNextPath, useCurrentUser } from '@/lib/auth';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { PlainLayout } from '@/components/layouts/plain-layout';
import { PageLoading } from '@/components/ui/page-loading';

export default function SignInRoute() {
  const me = useCurrentUser();
  const navigate = useNavigate();
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));

  if (me.isPending) return <PageLoading label="Checking your session" />;
  if (me.data) return <Navigate to={next ?? homeFor(me.data)} replace />;

  return (
    <PlainLayout>
      <div className="grid w-full max-w-[760px] grid-cols-1 border border-rule bg-sheet shadow-[0_1px_0_#d9d5cb,0_12px_32px_-18px_rgba(22,25,28,0.35)] md:grid-cols-[1fr_1.1fr]">
        <section className="on-dark flex flex-col justify-between gap-6 bg-graphite px-7 py-8 text-chalk">
          <div>
            <p className="text-[11.5px] font-bold uppercase tracking-[0.14em] text-brass">
              Critical lift review desk
            </p>
            <h1 className="mt-2 text-[26px] font-black leading-tight">Sign in to Counterpoise</h1>
            <p className="mt-3 text-sm leading-relaxed text-steel">
              Lift planners submit lift packages, coordinators run the site queue, and engineers of record
              decide — each package recomputed independently before anyone reviews it.
            </p>
          </div>
          <p className="text-[13px] leading-relaxed text-steel">
            Accounts are issued by the desk administrator of the site owner. If you cannot sign in, ask them
            to check your account; Counterpoise staff never ask for your password.
          </p>
        </section>
        <section className="px-7 py-8" aria-labelledby="sign-in-heading">
          <h2 id="sign-in-heading" className="mb-5 text-base font-bold">
            Your account
          </h2>
          <SignInForm onSignedIn={(user) => navigate(next ?? homeFor(user), { replace: true })} />
        </section>
      </div>
    </PlainLayout>
  );
}
