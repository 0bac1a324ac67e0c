/** The route table: each page is a thin route module, loaded when first visited. */
import { lazy, Suspense, type ComponentType, type LazyExoticComponent } from 'react';
import { createBrowserRouter } from 'react-router';
import { AppShell } from '../components/AppShell';
import { NotFoundPage } from './not-found';

function page(Page: LazyExoticComponent<ComponentType>) {
  return (
    <Suspense fallback={<p className="p-6 text-sm text-muted">Loading…</p>}>
      <Page />
    </Suspense>
  );
}

export const router = createBrowserRouter([
  {
    path: '/',
    element: <AppShell />,
    children: [
      { index: true, element: page(lazy(() => import('./sketch'))) },
      { path: 'book', element: page(lazy(() => import('./book'))) },
      { path: 'fit', element: page(lazy(() => import('./fit'))) },
      { path: 'paths', element: page(lazy(() => import('./paths'))) },
      { path: 'replay', element: page(lazy(() => import('./replay'))) },
      { path: 'library', element: page(lazy(() => import('./library'))) },
      { path: 'desk', element: page(lazy(() => import('./desk'))) },
      { path: 'signin', element: page(lazy(() => import('./sign-in'))) },
      { path: 'account', element: page(lazy(() => import('./account'))) },
      { path: 'reset', element: page(lazy(() => import('./reset'))) },
      { path: 'invite', element: page(lazy(() => import('./invite'))) },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
