import { createBrowserRouter } from 'react-router';
import { AppShell } from './components/AppShell';
import { AccountPage } from './routes/account/account';
import { SignInPage } from './routes/account/sign-in';
import { InvitePage, ResetPage } from './routes/account/token-pages';
import { BookPage } from './routes/book';
import { DeskPage } from './routes/desk';
import { FitPage } from './routes/fit';
import { LibraryPage } from './routes/library';
import { NotFoundPage } from './routes/not-found';
import { PathsPage } from './routes/paths';
import { ReplayPage } from './routes/replay';
import { SketchPage } from './routes/sketch';

export const router = createBrowserRouter([
  {
    path: '/',
    element: <AppShell />,
    children: [
      { index: true, element: <SketchPage /> },
      { path: 'book', element: <BookPage /> },
      { path: 'fit', element: <FitPage /> },
      { path: 'paths', element: <PathsPage /> },
      { path: 'replay', element: <ReplayPage /> },
      { path: 'library', element: <LibraryPage /> },
      { path: 'desk', element: <DeskPage /> },
      { path: 'signin', element: <SignInPage /> },
      { path: 'account', element: <AccountPage /> },
      { path: 'reset', element: <ResetPage /> },
      { path: 'invite', element: <InvitePage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
