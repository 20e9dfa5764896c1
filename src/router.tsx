/**
 * The studio's pages. Each page is a lazy route module in src/routes/
 * (exporting `Component`), so the first load carries only this table, the
 * shell and the page asked for; the workspace's editor and compiler load
 * only when a pattern is opened.
 */
import { createBrowserRouter, Navigate } from 'react-router';
import { AppShell } from './components/AppShell';
import { RequireSession } from './components/RequireSession';
import { RouteError } from './components/RouteError';
import { Loading } from './components/Loading';

export const router = createBrowserRouter([
  {
    element: <AppShell />,
    errorElement: <RouteError />,
    // Shown while the first page's lazy module loads.
    hydrateFallbackElement: <Loading />,
    children: [
      { index: true, element: <Navigate to="/patterns" replace /> },
      { path: 'sign-in', lazy: () => import('./routes/SignIn') },
      { path: 'sign-up', lazy: () => import('./routes/SignUp') },
      { path: 'reset-password', lazy: () => import('./routes/ResetRequest') },
      { path: 'reset-password/:token', lazy: () => import('./routes/ResetSet') },
      { path: 'invitations/:token', lazy: () => import('./routes/AcceptInvitation') },
      { path: 'dev/outbox', lazy: () => import('./routes/DevOutbox') },
      { path: 'shop', lazy: () => import('./routes/Shop') },
      { path: 'shop/:id', lazy: () => import('./routes/ShopListing') },
      {
        element: <RequireSession />,
        children: [
          { path: 'patterns', lazy: () => import('./routes/Library') },
          { path: 'patterns/:id', lazy: () => import('./routes/Workspace') },
          { path: 'patterns/:id/review', lazy: () => import('./routes/Review') },
          { path: 'patterns/:id/review/diff', lazy: () => import('./routes/ReviewDiff') },
          { path: 'patterns/:id/knit', lazy: () => import('./routes/Knit') },
          { path: 'account', lazy: () => import('./routes/Account') },
          { path: 'shop/thanks', lazy: () => import('./routes/ShopThanks') },
          { path: 'sales', lazy: () => import('./routes/Sales') },
          { path: 'patterns/:id/listing', lazy: () => import('./routes/ListingEditor') },
        ],
      },
      { path: '*', lazy: () => import('./routes/NotFound') },
    ],
  },
]);
