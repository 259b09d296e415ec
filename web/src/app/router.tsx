import { useState } from 'react';
import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router-dom';
import { paths } from '@/config/paths';
import { AccountRoute } from './routes/account';
import { AdminRoute } from './routes/admin';
import { AdminGroupsRoute } from './routes/admin-groups';
import { AdminOutboxRoute } from './routes/admin-outbox';
import { AdminOutboxMessageRoute } from './routes/admin-outbox-message';
import { AppRoot } from './routes/app-root';
import { CompareRoute } from './routes/compare';
import { FamilyRoute } from './routes/family';
import { GroupRoute } from './routes/group';
import { HomeRoute } from './routes/home';
import { InvitationRoute } from './routes/invitation';
import { MaintenanceRoute } from './routes/maintenance';
import { ModelRoute } from './routes/model';
import { ModelEditRoute } from './routes/model-edit';
import { ModelNewRoute } from './routes/model-new';
import { ModelsRoute } from './routes/models';
import { NotFoundRoute } from './routes/not-found';
import { NotificationsRoute } from './routes/notifications';
import { PointRoute } from './routes/point';
import { PreferencesRoute } from './routes/preferences';
import { RouteError } from './routes/route-error';
import { ScanRoute } from './routes/scan';
import { ScanNewRoute } from './routes/scan-new';
import { ScansRoute } from './routes/scans';
import { SignInRoute } from './routes/sign-in';
import { TokensRoute } from './routes/tokens';

export const routes: RouteObject[] = [
  { path: paths.signIn.path, element: <SignInRoute />, errorElement: <RouteError /> },
  // Invitation links reach people who may have no account yet.
  { path: paths.invitation.path, element: <InvitationRoute />, errorElement: <RouteError /> },
  {
    // Everything below needs a signed-in user; AppRoot checks and draws the header.
    element: <AppRoot />,
    errorElement: <RouteError />,
    children: [
      {
        // A page that crashes keeps the header, so the user can still navigate away.
        errorElement: <RouteError />,
        children: [
          { path: paths.home.path, element: <HomeRoute /> },
          { path: paths.scans.path, element: <ScansRoute /> },
          { path: paths.scanNew.path, element: <ScanNewRoute /> },
          { path: paths.scan.path, element: <ScanRoute /> },
          { path: paths.point.path, element: <PointRoute /> },
          { path: paths.models.path, element: <ModelsRoute /> },
          { path: paths.modelNew.path, element: <ModelNewRoute /> },
          { path: paths.family.path, element: <FamilyRoute /> },
          { path: paths.model.path, element: <ModelRoute /> },
          { path: paths.modelEdit.path, element: <ModelEditRoute /> },
          { path: paths.compare.path, element: <CompareRoute /> },
          { path: paths.admin.path, element: <AdminRoute /> },
          { path: paths.adminGroups.path, element: <AdminGroupsRoute /> },
          { path: paths.adminOutbox.path, element: <AdminOutboxRoute /> },
          { path: paths.adminOutboxMessage.path, element: <AdminOutboxMessageRoute /> },
          { path: paths.maintenance.path, element: <MaintenanceRoute /> },
          { path: paths.tokens.path, element: <TokensRoute /> },
          { path: paths.notifications.path, element: <NotificationsRoute /> },
          { path: paths.preferences.path, element: <PreferencesRoute /> },
          { path: paths.account.path, element: <AccountRoute /> },
          { path: paths.group.path, element: <GroupRoute /> },
          { path: '*', element: <NotFoundRoute /> },
        ],
      },
    ],
  },
];

export function AppRouter() {
  const [router] = useState(() => createBrowserRouter(routes));
  return <RouterProvider router={router} />;
}
