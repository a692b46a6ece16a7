import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { AppProviders } from './app/providers';
import { applyTheme, initialTheme } from './lib/theme';
import { registerServiceWorker } from './features/offline/api/register-service-worker';
import './styles.css';

applyTheme(initialTheme());
registerServiceWorker();

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProviders />
  </StrictMode>,
);
