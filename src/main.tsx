import '@fontsource-variable/public-sans';
import '@fontsource-variable/spline-sans-mono';
import './index.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { QueryClientProvider } from '@tanstack/react-query';
import { RouterProvider } from 'react-router/dom';
import { createAppRouter } from './app/router';
import { createQueryClient } from './lib/query-client';
import { installHumanMessages } from '../shared/schemas/human-messages';

// Form checks speak in words a person can act on, never in the validation library's wording.
installHumanMessages();

// Created once, outside React: loaders and components share this cache, and re-renders never rebuild the router.
const queryClient = createQueryClient();
const router = createAppRouter(queryClient);

const container = document.getElementById('root');
if (!container) throw new Error('Benchwire needs an element with id "root" in index.html.');

createRoot(container).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
