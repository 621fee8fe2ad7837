import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import { AppProvider } from '@/app/provider';
import { createAppRouter } from '@/app/router';
import { onSessionExpired } from '@/app/session-expiry';
import { applyColorMode, initialColorMode } from '@/components/ui/color-mode';
import { createQueryClient } from '@/lib/query-client';
import './fonts.css';

// Paint the first frame in the right mode, before React starts.
applyColorMode(initialColorMode());

// The client and the router need each other: a 401 from a query navigates; loaders query.
const queryClient = createQueryClient({
  onUnauthorized: () => onSessionExpired(queryClient, router),
});
const router = createAppRouter(queryClient);

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element.');

createRoot(root).render(
  <StrictMode>
    <AppProvider queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProvider>
  </StrictMode>,
);
