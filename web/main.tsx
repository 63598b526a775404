import '@fontsource/nunito-sans/latin-400.css';
import '@fontsource/nunito-sans/latin-600.css';
import '@fontsource/nunito-sans/latin-700.css';
import './styles/app.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import { AppProviders, createAppQueryClient } from './app/providers';
import { createAppRouter } from './app/router';

const container = document.getElementById('root');
if (!container) throw new Error('index.html must contain #root');

const queryClient = createAppQueryClient();
const router = createAppRouter();

createRoot(container).render(
  <StrictMode>
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>
  </StrictMode>,
);
