import '@fontsource/roboto-flex/index.css';
import './styles/app.css';
import { QueryClientProvider } from '@tanstack/react-query';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router/dom';
import { queryClient } from './lib/query-client';
import { installSessionExpiry, installTwoFactorRuleWatch } from './lib/session';
import { createRouter } from './router';

installSessionExpiry(queryClient);
installTwoFactorRuleWatch(queryClient);
const router = createRouter();

const container = document.getElementById('root');
if (!container) throw new Error('index.html has no #root element');

createRoot(container).render(
  <StrictMode>
    <QueryClientProvider client={queryClient}>
      <RouterProvider router={router} />
    </QueryClientProvider>
  </StrictMode>,
);
