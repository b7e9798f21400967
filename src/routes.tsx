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

// Every client route, in one place.
export const router = createBrowserRouter([
  {
    element: <Layout />,
    children: [
      { path: '/', element: <HomePage /> },
      { path: '/sheets/:id', element: <SheetPage /> },
      { path: '/sign-in', element: <SignInPage /> },
      { path: '/projects', element: <ProjectsPage /> },
      { path: '/projects/:id', element: <CloudSheetPage /> },
      { path: '/projects/:id/settings', element: <ProjectSettingsPage /> },
      { path: '/invitations/:token', element: <InvitationPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
