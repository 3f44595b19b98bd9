import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/merriweather/latin-400.css';
import '@fontsource/merriweather/latin-ext-400.css';
import '@fontsource/merriweather/latin-700.css';
import '@fontsource/merriweather/latin-ext-700.css';
import '@fontsource/source-sans-3/latin-400.css';
import '@fontsource/source-sans-3/latin-ext-400.css';
import '@fontsource/source-sans-3/latin-600.css';
import '@fontsource/source-sans-3/latin-ext-600.css';
import './styles.css';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import { queryClient } from './lib/query-client';
import { startQueryPersistence } from './lib/query-persistence';
import { registerServiceWorkerAfterLoad } from './lib/register-service-worker';

// The last data this person saw comes back from IndexedDB before the first render (no signal, no blank page).
await startQueryPersistence(queryClient);

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <AppProvider>
      <AppRouter />
    </AppProvider>
  </StrictMode>,
);

// The service worker (offline app shell, update prompt) registers once the page has loaded.
registerServiceWorkerAfterLoad();
