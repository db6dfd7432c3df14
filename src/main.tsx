import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import '@fontsource/source-sans-3/400.css';
import '@fontsource/source-sans-3/600.css';
import '@fontsource/source-sans-3/700.css';
import './styles.css';
import { AppProvider } from './app/provider';
import { AppRouter } from './app/router';
import { lastUser, persistCacheFor } from './lib/offline-cache';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

// The last user's saved cache first: without signal, it is what the app opens to.
void persistCacheFor(lastUser()).finally(() =>
  createRoot(root).render(
    <StrictMode>
      <AppProvider>
        <AppRouter />
      </AppProvider>
    </StrictMode>,
  ),
);
