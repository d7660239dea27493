// Every client route. Pages are split into their own chunks; the role table in
// lib/roles.ts decides who may open each desk page and which links they see.
import { lazy, Suspense, type ReactNode } from 'react';
import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { RequireAuth, RequireRole } from '@/lib/auth';
import { rolesFor } from '@/lib/roles';
import { AppShell } from '@/components/layouts/app-shell';
import { PageLoading } from '@/components/ui/page-loading';
import { RouteError } from './route-error';
import SignInRoute from './routes/sign-in';
import NotFoundRoute from './routes/not-found';
import HomeRoute from './routes/home';

const PackagesRoute = lazy(() => import('./routes/packages'));
const QueueRoute = lazy(() => import('./routes/queue'));
const AssignedRoute = lazy(() => import('./routes/assigned'));
const AdminRoute = lazy(() => import('./routes/admin'));
const PackageDetailRoute = lazy(() => import('./routes/package-detail'));
const PackageNewRoute = lazy(() => import('./routes/package-new'));
const PackageEditRoute = lazy(() => import('./routes/package-edit'));
const VerifyRoute = lazy(() => import('./routes/verify'));
const ReviewWorkspaceRoute = lazy(() => import('./routes/review-workspace'));
const AdminOrganisationsRoute = lazy(() => import('./routes/admin-organisations'));
const AdminSitesRoute = lazy(() => import('./routes/admin-sites'));
const AdminSitePolicyRoute = lazy(() => import('./routes/admin-site-policy'));
const AdminPeopleRoute = lazy(() => import('./routes/admin-people'));
const AdminMailRoute = lazy(() => import('./routes/admin-mail'));
const ProfileRoute = lazy(() => import('./routes/profile'));
const InviteRoute = lazy(() => import('./routes/invite'));
const LibraryRoute = lazy(() => import('./routes/library'));
const LibraryCraneRoute = lazy(() => import('./routes/library-crane'));
const LibraryConfigurationRoute = lazy(() => import('./routes/library-configuration'));
const LibraryVersionRoute = lazy(() => import('./routes/library-version'));

function contractorOnly(path: string, element: ReactNode): RouteObject {
  return {
    path,
    element: (
      <RequireRole roles={['contractor']}>
        <Page>{element}</Page>
      </RequireRole>
    ),
  };
}

function Page({ children }: { children: ReactNode }) {
  return <Suspense fallback={<PageLoading label="Opening the page" />}>{children}</Suspense>;
}

/** A desk page open to the roles of its navigation entry; pages below one (a site's policy under Sites) name it. */
function guarded(path: string, element: ReactNode, navPath = path): RouteObject {
  return {
    path,
    element: (
      <RequireRole roles={rolesFor(navPath)}>
        <Page>{element}</Page>
      </RequireRole>
    ),
  };
}

export const routes: RouteObject[] = [
  { path: '/sign-in', element: <SignInRoute />, errorElement: <RouteError /> },
  // Public: a person invited by e-mail sets their password from the one-time link.
  {
    path: '/invite/:token',
    element: (
      <Page>
        <InviteRoute />
      </Page>
    ),
    errorElement: <RouteError />,
  },
  // Public: anyone on site checks a stamped return's code without signing in.
  {
    path: '/verify',
    element: (
      <Page>
        <VerifyRoute />
      </Page>
    ),
    errorElement: <RouteError />,
  },
  {
    path: '/verify/:code',
    element: (
      <Page>
        <VerifyRoute />
      </Page>
    ),
    errorElement: <RouteError />,
  },
  {
    path: '/',
    element: (
      <RequireAuth>
        <AppShell />
      </RequireAuth>
    ),
    errorElement: <RouteError />,
    children: [
      { index: true, element: <HomeRoute /> },
      guarded('/packages', <PackagesRoute />),
      guarded('/queue', <QueueRoute />),
      guarded('/assigned', <AssignedRoute />),
      guarded('/admin', <AdminRoute />),
      guarded('/admin/organisations', <AdminOrganisationsRoute />),
      guarded('/admin/sites', <AdminSitesRoute />),
      guarded('/admin/sites/:id/policy', <AdminSitePolicyRoute />, '/admin/sites'),
      guarded('/admin/people', <AdminPeopleRoute />),
      guarded('/admin/mail', <AdminMailRoute />),
      guarded('/profile', <ProfileRoute />),
      guarded('/library', <LibraryRoute />),
      contractorOnly('/library/cranes/:id', <LibraryCraneRoute />),
      contractorOnly('/library/configurations/:id', <LibraryConfigurationRoute />),
      {
        path: '/library/versions/:id',
        element: (
          <Page>
            <LibraryVersionRoute />
          </Page>
        ),
      },
      contractorOnly('/packages/new', <PackageNewRoute />),
      contractorOnly('/packages/:id/edit', <PackageEditRoute />),
      {
        path: '/packages/:id/review',
        element: (
          <RequireRole roles={['engineer', 'reviewer', 'admin']}>
            <Page>
              <ReviewWorkspaceRoute />
            </Page>
          </RequireRole>
        ),
      },
      {
        path: '/packages/:id',
        element: (
          <Page>
            <PackageDetailRoute />
          </Page>
        ),
      },
    ],
  },
  { path: '*', element: <NotFoundRoute /> },
];

export function createRouter() {
  return createBrowserRouter(routes);
}
