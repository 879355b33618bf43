import { createBrowserRouter } from 'react-router';
import { RootLayout } from './routes/root';
import { HomePage } from './routes/home';
import { RouteError } from './routes/error';

export const router = createBrowserRouter([
  {
    path: '/',
    element: <RootLayout />,
    errorElement: <RouteError />,
    children: [{ index: true, element: <HomePage /> }],
  },
]);
