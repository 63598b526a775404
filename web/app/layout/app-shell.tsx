import { Outlet, useNavigation } from 'react-router-dom';
import { AppHeader } from './app-header';
import { MainNav } from './main-nav';

export function AppShell() {
  const navigation = useNavigation();
  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-3 focus:top-3 focus:z-50 focus:rounded-lg focus:bg-surface-0 focus:px-4 focus:py-2"
      >
        Skip to main content
      </a>
      <AppHeader />
      {navigation.state === 'loading' && (
        <div role="progressbar" aria-label="Opening page" className="h-1 w-full animate-pulse bg-brand-400" />
      )}
      <div className="mx-auto flex w-full max-w-7xl flex-1">
        <MainNav />
        <main id="main" tabIndex={-1} className="min-w-0 flex-1 px-3 pb-28 pt-6 sm:px-6 lg:pb-10">
          <Outlet />
        </main>
      </div>
    </div>
  );
}
