import { createBrowserRouter } from 'react-router-dom';
import { Layout } from './components/Layout';
import { HomePage } from './pages/HomePage';
import { SheetPage } from './pages/SheetPage';
import { NotFoundPage } from './pages/NotFoundPage';
// Cloud projects (accounts, roles, invitations); the import also registers the cloud sheet sources.
import './cloud/registerCloudSources';
import { SignInPage } from './pages/SignInPage';
import { ProjectsPage } from './pages/ProjectsPage';
import { ProjectSettingsPage } from './pages/ProjectSettingsPage';
import { CloudSheetPage } from './pages/CloudSheetPage';
import { InvitationPage } from './pages/InvitationPage';
// Design tools: sweep, tolerance and budget tabs, the designer dialog and export (registers with the editor).
import './editor/tools/register';
import { ReportPage } from './pages/ReportPage';

// Every client route, in one place.
export const router = createBrowserRouter([
  {
    element: <Layout />,
    children: [
      { path: '/', element: <HomePage /> },
      { path: '/sheets/:id', element: <SheetPage /> },
      { path: '/sheets/:id/report', element: <ReportPage /> },
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/projects', element: <ProjectsPage /> },
      { path: '/projects/:id', element: <CloudSheetPage /> },
      { path: '/projects/:id/settings', element: <ProjectSettingsPage /> },
      { path: '/projects/:id/report', element: <ReportPage /> },
      { path: '/invitations/:token', element: <InvitationPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
