import { createBrowserRouter, type RouteObject } from 'react-router-dom';
import { AppLayout } from '../components/AppLayout';
import { NotFoundPage } from '../components/NotFoundPage';
import { AuditLogPage } from '../features/audit/components/AuditLogPage';
import { AcceptInvitationPage } from '../features/auth/components/AcceptInvitationPage';
import { ConfirmSignUpPage } from '../features/auth/components/ConfirmSignUpPage';
import { ForgotPasswordPage } from '../features/auth/components/ForgotPasswordPage';
import { RequireSession } from '../features/auth/components/RequireSession';
import { ResetPasswordPage } from '../features/auth/components/ResetPasswordPage';
import { SignInPage } from '../features/auth/components/SignInPage';
import { GroupsPage } from '../features/groups/components/GroupsPage';
import { OpenBundlePage } from '../features/bundles/components/OpenBundlePage';
import { NotebookPage } from '../features/notebook/components/NotebookPage';
import { StudyListPage } from '../features/studies/components/StudyListPage';
import { SignUpPage } from '../features/auth/components/SignUpPage';
import { MembersPage } from '../features/members/components/MembersPage';
import { OutboxPage } from '../features/outbox/components/OutboxPage';
import { DatasetImportPage } from '../features/datasets/components/DatasetImportPage';
import { DatasetListPage } from '../features/datasets/components/DatasetListPage';
import { DatasetPage } from '../features/datasets/components/DatasetPage';

export const routes: RouteObject[] = [
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/sign-up', element: <SignUpPage /> },
  { path: '/confirm-sign-up', element: <ConfirmSignUpPage /> },
  { path: '/forgot-password', element: <ForgotPasswordPage /> },
  { path: '/reset-password', element: <ResetPasswordPage /> },
  { path: '/accept-invitation', element: <AcceptInvitationPage /> },
  {
    element: (
      <RequireSession>
        <AppLayout />
      </RequireSession>
    ),
    children: [
      { index: true, element: <StudyListPage /> },
      { path: '/labs/:labId', element: <StudyListPage /> },
      { path: '/labs/:labId/studies/:studyId', element: <NotebookPage /> },
      { path: '/labs/:labId/groups', element: <GroupsPage /> },
      { path: '/labs/:labId/datasets', element: <DatasetListPage /> },
      { path: '/labs/:labId/datasets/new', element: <DatasetImportPage /> },
      { path: '/labs/:labId/datasets/:datasetId', element: <DatasetPage /> },
      { path: '/labs/:labId/bundles/open', element: <OpenBundlePage /> },
      { path: '/labs/:labId/members', element: <MembersPage /> },
      { path: '/labs/:labId/audit', element: <AuditLogPage /> },
      { path: '/labs/:labId/outbox', element: <OutboxPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
];

export const createRouter = () => createBrowserRouter(routes);
