/**
 * Browser entry: fonts, styles, the query client and the router.
 * Only Inter (the UI face) loads here, in the three weights the UI uses;
 * JetBrains Mono loads with the workspace, where the editor needs it.
 */
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router/dom';
import '@fontsource/inter/latin-400.css';
import '@fontsource/inter/latin-500.css';
import '@fontsource/inter/latin-600.css';
import './styles/app.css';
import { router } from './router';
import { isApiStatus } from './api/client';

const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 15_000,
      // Client errors (401/403/404) will not change on a retry; a dropped
      // connection might.
      retry: (count, err) => count < 2 && !(isApiStatus(err, 401) || isApiStatus(err, 403) || isApiStatus(err, 404)),
    },
  },
});

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');
createRoot(root).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
