import { useState } from 'react';
import { createBrowserRouter, Navigate, RouterProvider, type RouteObject } from 'react-router-dom';
import { paths } from '@/config/paths';
import { AdminRoute } from './routes/admin';
import { AppRoot } from './routes/app-root';
import { CompareRoute } from './routes/compare';
import { GroupRoute } from './routes/group';
import { ModelsRoute } from './routes/models';
import { NotFoundRoute } from './routes/not-found';
import { RouteError } from './routes/route-error';
import { ScansRoute } from './routes/scans';
import { SignInRoute } from './routes/sign-in';
import { TokensRoute } from './routes/tokens';

export const routes: RouteObject[] = [
  { path: paths.signIn.path, element: <SignInRoute />, errorElement: <RouteError /> },
  { path: paths.home.path, element: <Navigate to={paths.scans.getHref()} replace /> },
  {
    // Everything below needs a signed-in user; AppRoot checks and draws the header.
    element: <AppRoot />,
    errorElement: <RouteError />,
    children: [
      {
        // A page that crashes keeps the header, so the user can still navigate away.
        errorElement: <RouteError />,
        children: [
          { path: paths.scans.path, element: <ScansRoute /> },
          { path: paths.models.path, element: <ModelsRoute /> },
          { path: paths.compare.path, element: <CompareRoute /> },
          { path: paths.admin.path, element: <AdminRoute /> },
          { path: paths.tokens.path, element: <TokensRoute /> },
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
