// The frame of every signed-in page: the graphite rail with the links this person's role
// may use, who is signed in, sign-out, and the standing caution under the content. On a
// phone the rail folds into a bar with a Menu button (site staff open packages and returns
// there); printed, only the content and the caution remain.
import { useState } from 'react';
import { NavLink, Outlet, useLocation, useNavigate } from 'react-router-dom';
import type { CurrentUser } from '@shared/schemas/auth';
import { useCurrentUser, useSignOut } from '@/lib/auth';
import { navItemsFor, ROLE_LABELS } from '@/lib/roles';
import { Wordmark } from '@/components/ui/logo';
import { CautionNote } from '@/components/ui/caution-note';
import { HandOffsButton } from '@/features/hand-offs/components/hand-offs-button';
import { useLiveUpdates } from '@/lib/live-updates';

function Initials({ name }: { name: string }) {
  const letters = name
    .replace(/,.*$/, '')
    .split(/\s+/)
    // Titles like "Dr." are not part of the initials.
    .filter((part) => part && !part.endsWith('.'))
    .slice(0, 2)
    .map((part) => part[0]?.toUpperCase())
    .join('');
  return (
    <span
      aria-hidden="true"
      className="flex size-8 shrink-0 items-center justify-center rounded-sm bg-graphite-line text-[13px] font-black text-chalk"
    >
      {letters}
    </span>
  );
}

function SignedInAs({ user }: { user: CurrentUser }) {
  const navigate = useNavigate();
  const signOut = useSignOut();
  return (
    <section aria-label="Signed in" className="border-t border-graphite-line px-4 py-4">
      <div className="flex items-start gap-2.5">
        <Initials name={user.name} />
        <div className="min-w-0">
          <p className="truncate text-sm font-bold text-chalk" data-testid="user-name">
            {user.name}
          </p>
          <p className="text-[12.5px] text-steel">{ROLE_LABELS[user.role]}</p>
          <p className="truncate text-[12.5px] text-steel" title={user.organisation.name}>
            {user.organisation.name}
          </p>
        </div>
      </div>
      <button
        type="button"
        disabled={signOut.isPending}
        onClick={() =>
          signOut.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) })
        }
        className="mt-3 h-8 w-full rounded-[3px] border border-graphite-line text-[13px] font-bold text-chalk hover:border-steel hover:bg-graphite-raised disabled:opacity-70"
      >
        {signOut.isPending ? 'Signing out…' : 'Sign out'}
      </button>
    </section>
  );
}

function RailLinks({
  items,
  label,
  className = '',
}: {
  items: ReturnType<typeof navItemsFor>;
  label: string;
  className?: string;
}) {
  return (
    <nav aria-label={label} className={className}>
      <ul className="flex flex-col">
        {items.map((item) => (
          <li key={item.to}>
            <NavLink
              to={item.to}
              end={item.end}
              title={item.description}
              className={({ isActive }) =>
                `flex h-10 items-center border-l-4 pl-4 pr-3 text-sm font-bold ${
                  isActive
                    ? 'border-brass bg-graphite-raised text-chalk'
                    : 'border-transparent text-steel hover:bg-graphite-raised hover:text-chalk'
                }`
              }
            >
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
      <HandOffsButton />
    </nav>
  );
}

export function AppShell() {
  const { data: user } = useCurrentUser();
  // The phone menu is open on the page where it was opened: following a link closes it.
  const location = useLocation();
  const [menuAt, setMenuAt] = useState<string | null>(null);
  const menuOpen = menuAt === location.pathname;
  // Pages refresh in place when someone else changes what they show.
  useLiveUpdates(Boolean(user));
  if (!user) return null;
  const items = navItemsFor(user.role);

  return (
    <div className="flex min-h-screen flex-col md:flex-row print:block">
      <a
        href="#main"
        className="sr-only z-50 bg-sheet px-3 py-2 font-bold text-ink focus:not-sr-only focus:fixed focus:left-2 focus:top-2"
      >
        Skip to content
      </a>
      <header className="on-dark sticky top-0 z-30 flex items-center justify-between bg-graphite px-3 py-2 text-chalk md:hidden print:hidden">
        <Wordmark className="text-chalk" />
        <button
          type="button"
          aria-expanded={menuOpen}
          aria-controls="phone-menu"
          onClick={() => setMenuAt(menuOpen ? null : location.pathname)}
          className="h-8 rounded-[3px] border border-graphite-line px-3 text-[13px] font-bold text-chalk"
        >
          {menuOpen ? 'Close menu' : 'Menu'}
        </button>
      </header>
      {menuOpen && (
        <div
          id="phone-menu"
          className="on-dark fixed inset-x-0 top-12 z-30 bg-graphite text-chalk md:hidden print:hidden"
        >
          <RailLinks items={items} label="Main" />
          <SignedInAs user={user} />
        </div>
      )}
      <aside className="on-dark sticky top-0 hidden h-screen w-[232px] shrink-0 flex-col bg-graphite text-chalk md:flex print:hidden">
        <div className="px-4 pb-5 pt-4">
          <Wordmark className="text-chalk" />
          <p className="mt-1 pl-9 text-[11.5px] uppercase tracking-[0.12em] text-steel">
            Critical lift review
          </p>
        </div>
        <RailLinks items={items} label="Main" className="flex-1 overflow-y-auto" />
        <SignedInAs user={user} />
      </aside>
      <div className="flex min-w-0 flex-1 flex-col">
        <main
          id="main"
          tabIndex={-1}
          className="flex-1 px-3 pb-8 pt-4 focus:outline-none sm:px-6 sm:pt-5 print:p-0"
        >
          <Outlet />
        </main>
        <CautionNote className="bg-chalk" />
      </div>
    </div>
  );
}
