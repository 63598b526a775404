import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { PageHeading } from '../../components/ui/page-heading';
import { isApiError } from '../../lib/api-error';
import { usePageTitle } from '../../lib/page-title';

function describe(error: unknown): { title: string; message: string } {
  if (isRouteErrorResponse(error) && error.status === 404) {
    return { title: 'Page not found', message: 'There is no page at this address.' };
  }
  if (isApiError(error) && error.status === 0) {
    return { title: 'No connection', message: error.message };
  }
  if (isApiError(error) && error.status >= 500) {
    return {
      title: 'The server had a problem',
      message: 'Nestflow could not load this page because the server ran into an error. Nothing you saved has been lost. Try again in a moment.',
    };
  }
  return { title: 'This page could not be shown', message: 'Something went wrong while opening this page. Try again, or go back to your home page.' };
}

/** The route-level error boundary: readable words, a way to retry, never a stack trace. */
export function RouteError() {
  const { title, message } = describe(useRouteError());
  usePageTitle(title);
  return (
    <div role="alert" className="mx-auto flex max-w-xl flex-col gap-4 px-4 py-12">
      <PageHeading className="text-2xl font-bold text-ink-900">{title}</PageHeading>
      <p className="text-ink-700">{message}</p>
      <div className="flex flex-wrap gap-3">
        <Button onClick={() => window.location.reload()}>Try again</Button>
        <Link to="/" className="inline-flex min-h-11 items-center rounded-lg px-4 font-semibold text-brand-700 underline">
          Go to your home page
        </Link>
      </div>
    </div>
  );
}
