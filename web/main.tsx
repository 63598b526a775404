import '@fontsource/nunito-sans/latin-400.css';
import '@fontsource/nunito-sans/latin-600.css';
import '@fontsource/nunito-sans/latin-700.css';
import './styles/app.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import { AppProviders, createAppQueryClient } from './app/providers';
import { createAppRouter } from './app/router';
import { sessionQueryOptions } from './features/session/api/session-keys';

const container = document.getElementById('root');
if (!container) throw new Error('index.html must contain #root');

const queryClient = createAppQueryClient();
// Who is signed in is needed by every page: ask now, in parallel with loading the first page's code.
void queryClient.prefetchQuery(sessionQueryOptions());
const router = createAppRouter(queryClient);

createRoot(container).render(
  <StrictMode>
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>
  </StrictMode>,
);
