import { createBrowserRouter } from 'react-router-dom';
import { Layout } from './components/Layout';
import { HomePage } from './pages/HomePage';
import { SheetPage } from './pages/SheetPage';
import { NotFoundPage } from './pages/NotFoundPage';

// Every client route, in one place.
export const router = createBrowserRouter([
  {
    element: <Layout />,
    children: [
      { path: '/', element: <HomePage /> },
      { path: '/sheets/:id', element: <SheetPage /> },
      { path: '*', element: <NotFoundPage /> },
    ],
  },
]);
