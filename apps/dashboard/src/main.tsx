import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router';
import { router } from './router';
import './theme.css';

const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: 15_000 } } });

const rootEl = document.getElementById('root');
if (!rootEl) throw new Error('index.html has no #root element');
createRoot(rootEl).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
