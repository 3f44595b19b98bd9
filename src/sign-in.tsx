/** The sign-in page's entry (index.html): React and the form only; the app (src/app.html) loads after sign-in. */
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
import { LoginPage } from './app/routes/auth/login';
import { registerServiceWorkerAfterLoad } from './lib/register-service-worker';

createRoot(document.getElementById('root')!).render(
  <StrictMode>
    <LoginPage />
  </StrictMode>,
);

// While the person types, the service worker fetches the app shell (field sheet, portal) for after sign-in.
registerServiceWorkerAfterLoad({ onFirstInput: true });
