import { StrictMode, Suspense } from 'react';
import { createRoot } from 'react-dom/client';
import { BrowserRouter } from 'react-router-dom';
import { Providers } from './app/providers';
import { AppRoutes } from './app/router';
import './i18n/i18n';
import './index.css';

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element.');

createRoot(root).render(
  <StrictMode>
    <Providers>
      {/* A language other than English loads its catalogue on first use, and a screen its code; the screen waits for
          both, never drawing a key. */}
      <Suspense fallback={null}>
        <BrowserRouter>
          <AppRoutes />
        </BrowserRouter>
      </Suspense>
    </Providers>
  </StrictMode>,
);
