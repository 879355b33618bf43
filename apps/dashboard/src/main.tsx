import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router';
import { router } from './router';
import { OutageBanner } from './components/outage-banner';
import { queryClient } from './lib/query-client';
import { refreshCsrf } from './lib/api';
import './theme.css';

// Ask for the CSRF token at start, so the first form sent does not wait for it.
void refreshCsrf();

const rootEl = document.getElementById('root');
if (!rootEl) throw new Error('index.html has no #root element');
createRoot(rootEl).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      {/* Outside the router: it shows while route loaders are still waiting out an outage too. */}
      <OutageBanner />
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
