import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import './index.css';
import { AppProvider } from './app/provider.tsx';
import { AppRouter } from './app/router.tsx';
import { registerServiceWorker } from './lib/register-service-worker.ts';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);

registerServiceWorker();
