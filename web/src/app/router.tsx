import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { AppLayout } from '../components/AppLayout';
import { NotFoundPage } from '../components/NotFoundPage';
import { SignInPage } from '../features/auth/components/SignInPage';
import { NotebookPage } from '../features/notebook/components/NotebookPage';
import { StudyListPage } from '../features/studies/components/StudyListPage';

export const routes: RouteObject[] = [
  { path: '/sign-in', element: <SignInPage /> },
  {
    element: <AppLayout />,
    children: [
      { index: true, element: <StudyListPage /> },
      { path: '/labs/:labId', element: <StudyListPage /> },
      { path: '/labs/:labId/studies/:studyId', element: <NotebookPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
];

export const createRouter = () => createBrowserRouter(routes);
