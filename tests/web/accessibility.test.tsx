import { act, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { createMemoryRouter, Link, RouterProvider } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { RootLayout } from '../../web/app/layout/root-layout';
import { ErrorSummary } from '../../web/components/ui/error-summary';
import { TextField } from '../../web/components/ui/field';
import { useFocusWhenClosed } from '../../web/components/ui/focus';
import { InPageLink } from '../../web/components/ui/in-page-link';
import { PageHeader } from '../../web/components/ui/page-header';
import { ScrollRegion } from '../../web/components/ui/scroll-region';
import { dismissToast, getToasts, pauseToasts, resumeToasts, showToast, TOAST_VISIBLE_MS } from '../../web/components/ui/toast-store';
import { pageTitle, usePageTitle } from '../../web/lib/page-title';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

afterEach(() => {
  vi.useRealTimers();
  document.title = '';
});

describe('page title', () => {
  it('when a page is about one baby, then the title reads page · baby · Nestflow; otherwise page · Nestflow', () => {
    expect(pageTitle('Sign off', 'Ada Brindlewood')).toBe('Sign off · Ada Brindlewood · Nestflow');
    expect(pageTitle('Caseload')).toBe('Caseload · Nestflow');
    expect(pageTitle('Record', '')).toBe('Record · Nestflow');
  });

  it('when a page opens and then closes, then the tab is named after it and then back to the bare name', () => {
    function Page({ baby }: { baby?: string }) {
      usePageTitle('Log a reading', baby);
      return null;
    }
    const { rerender, unmount } = render(<Page />);
    expect(document.title).toBe('Log a reading · Nestflow');
    rerender(<Page baby="Wren Tallis" />);
    expect(document.title).toBe('Log a reading · Wren Tallis · Nestflow');
    unmount();
    expect(document.title).toBe('Nestflow');
  });

  it('when a signed-in person opens the real caseload route, then the document title names it', async () => {
    stubApi({
      'GET /api/session': sessionHandler('coordinator'),
      'GET /api/infants': () => json(200, { items: [], total: 0, page: 1, pageSize: 25 }),
    });
    renderApp('/caseload');
    await screen.findByRole('heading', { level: 1, name: 'Caseload' });
    await waitFor(() => expect(document.title).toBe('Caseload · Nestflow'));
  });
});

describe('focus on the page heading after navigation', () => {
  function Slow() {
    // A page that shows a spinner first, as pages waiting for their data do.
    const [ready, setReady] = useState(false);
    return ready ? <PageHeader title="Second page" /> : <button type="button" onClick={() => setReady(true)}>Load</button>;
  }
  const routes = [
    {
      element: <RootLayout />,
      children: [
        { path: '/', element: <><PageHeader title="First page" /><Link to="/second">Go on</Link><Link to="/?sort=name">Sort</Link></> },
        { path: '/second', element: <Slow /> },
      ],
    },
  ];

  it('when a link opens another page, then focus lands on its h1 once it appears, not before', async () => {
    const router = createMemoryRouter(routes, { initialEntries: ['/'] });
    const user = userEvent.setup();
    render(<RouterProvider router={router} />);
    await waitFor(() => expect(screen.getByRole('heading', { level: 1, name: 'First page' })).toHaveFocus());

    await user.click(screen.getByRole('link', { name: 'Go on' }));
    expect(currentUrl(router)).toBe('/second');
    // Still loading: nothing to focus yet, and the heading takes focus as soon as it is rendered.
    act(() => screen.getByRole('button', { name: 'Load' }).click());
    const heading = await screen.findByRole('heading', { level: 1, name: 'Second page' });
    await waitFor(() => expect(heading).toHaveFocus());
    expect(heading).toHaveAttribute('tabindex', '-1');
  });

  it('when only the query string changes (sorting, filters), then focus stays where the person is', async () => {
    const router = createMemoryRouter(routes, { initialEntries: ['/'] });
    const user = userEvent.setup();
    render(<RouterProvider router={router} />);
    const sort = screen.getByRole('link', { name: 'Sort' });
    await user.click(sort);
    expect(currentUrl(router)).toBe('/?sort=name');
    expect(sort).toHaveFocus();
  });

  it('when the real app signs a person in, then focus lands on their home page heading', async () => {
    let signedIn = false;
    stubApi({
      'GET /api/session': (request) => sessionHandler(signedIn ? 'admin' : null)(request),
      'POST /api/session': (request) => {
        signedIn = true;
        return sessionHandler('admin', 'csrf-2')(request);
      },
      'GET /api/health/ready': () => json(200, { status: 'ok', db: 'ok', redis: 'ok', migrations: 'current', workers: { status: 'ok', running: 1, seen: [] } }),
    });
    const { user } = renderApp('/sign-in');
    const signInHeading = await screen.findByRole('heading', { level: 1, name: 'Sign in' });
    await waitFor(() => expect(signInHeading).toHaveFocus());
    await user.type(screen.getByLabelText('E-mail'), 'admin@larkmoor.example');
    await user.type(screen.getByLabelText('Password'), 'nestflow-demo');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    const home = await screen.findByRole('heading', { level: 1, name: 'Overview' });
    await waitFor(() => expect(home).toHaveFocus());
    expect(document.title).toBe('Overview · Nestflow');
  });
});

describe('error summary', () => {
  function TwoFieldForm({ onValid }: { onValid: () => void }) {
    const { register, handleSubmit, formState: { errors, submitCount } } = useForm<{ spo2: string; pulse: string }>({
      defaultValues: { spo2: '', pulse: '' },
    });
    return (
      <form noValidate onSubmit={handleSubmit(onValid)}>
        <ErrorSummary attempt={submitCount} />
        <TextField label="SpO2 (%)" error={errors.spo2?.message} {...register('spo2', { required: 'Enter the SpO2' })} />
        <TextField label="Pulse (/min)" error={errors.pulse?.message} {...register('pulse', { required: 'Enter the pulse' })} />
        <button type="submit">Save reading</button>
      </form>
    );
  }

  it('when a submit fails, then a focused summary lists every problem as a link to its field, in page order', async () => {
    const onValid = vi.fn();
    const user = userEvent.setup();
    render(<TwoFieldForm onValid={onValid} />);
    expect(screen.queryByRole('region', { name: 'There is a problem' })).not.toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Save reading' }));
    const summary = await screen.findByRole('region', { name: 'There is a problem' });
    await waitFor(() => expect(summary).toHaveFocus());
    const links = within(summary).getAllByRole('link');
    expect(links.map((link) => link.textContent)).toEqual(['SpO2 (%): Enter the SpO2', 'Pulse (/min): Enter the pulse']);
    expect(links[1]).toHaveAttribute('href', `#${screen.getByLabelText('Pulse (/min)').id}`);

    // The second problem is one Tab and Enter away, not found only by tabbing through the form.
    await user.click(links[1]);
    expect(screen.getByLabelText('Pulse (/min)')).toHaveFocus();
    expect(onValid).not.toHaveBeenCalled();
  });

  it('when one field is fixed, then it leaves the list without pulling focus back; a fresh failure focuses the summary again', async () => {
    const user = userEvent.setup();
    render(<TwoFieldForm onValid={vi.fn()} />);
    await user.click(screen.getByRole('button', { name: 'Save reading' }));
    const summary = await screen.findByRole('region', { name: 'There is a problem' });
    const spo2 = screen.getByLabelText('SpO2 (%)');
    await user.type(spo2, '94');
    await waitFor(() => expect(within(summary).getAllByRole('link')).toHaveLength(1));
    expect(spo2).toHaveFocus();

    await user.click(screen.getByRole('button', { name: 'Save reading' }));
    await waitFor(() => expect(screen.getByRole('region', { name: 'There is a problem' })).toHaveFocus());
    expect(within(screen.getByRole('region', { name: 'There is a problem' })).getByRole('link')).toHaveTextContent('Pulse (/min): Enter the pulse');
  });

  it('when the server refuses the whole save, then its message heads the summary and takes focus', async () => {
    function Refused() {
      const [problem, setProblem] = useState<string>();
      return (
        <form noValidate onSubmit={(event) => { event.preventDefault(); setProblem('No connection to Nestflow.'); }}>
          <ErrorSummary attempt={0} problem={problem} />
          <button type="submit">Send</button>
        </form>
      );
    }
    const user = userEvent.setup();
    render(<Refused />);
    await user.click(screen.getByRole('button', { name: 'Send' }));
    const summary = await screen.findByRole('region', { name: 'There is a problem' });
    expect(summary).toHaveTextContent('No connection to Nestflow.');
    await waitFor(() => expect(summary).toHaveFocus());
  });
});

describe('in-page links and scroll regions', () => {
  it('when "Go to the decision" is followed, then focus moves to the decision, not only the scroll position', async () => {
    const user = userEvent.setup();
    render(<><InPageLink target="decision">Go to the decision</InPageLink><div id="decision">Decision</div></>);
    await user.click(screen.getByRole('link', { name: 'Go to the decision' }));
    expect(screen.getByText('Decision')).toHaveFocus();
  });

  it('when an in-place editor closes after a save, then focus returns to the button that opened it', async () => {
    function Section() {
      const [editing, setEditing] = useState(false);
      const edit = useFocusWhenClosed<HTMLButtonElement>(editing);
      return editing
        ? <button type="button" onClick={() => setEditing(false)}>Save details</button>
        : <button type="button" ref={edit} onClick={() => setEditing(true)}>Edit details</button>;
    }
    const user = userEvent.setup();
    render(<Section />);
    expect(screen.getByRole('button', { name: 'Edit details' })).not.toHaveFocus();
    await user.click(screen.getByRole('button', { name: 'Edit details' }));
    await user.click(screen.getByRole('button', { name: 'Save details' }));
    expect(screen.getByRole('button', { name: 'Edit details' })).toHaveFocus();
  });

  it('when a table is wider than its box, then the box is a named region in the Tab order; when it fits, it is not', () => {
    const widths = vi.spyOn(HTMLElement.prototype, 'scrollWidth', 'get').mockReturnValue(900);
    vi.spyOn(HTMLElement.prototype, 'clientWidth', 'get').mockReturnValue(300);
    const { unmount } = render(<ScrollRegion label="How the setting was worked out"><table><tbody><tr><td>1</td></tr></tbody></table></ScrollRegion>);
    const region = screen.getByRole('region', { name: 'How the setting was worked out' });
    expect(region).toHaveAttribute('tabindex', '0');
    unmount();
    widths.mockReturnValue(300);
    render(<ScrollRegion label="Fits"><p>narrow</p></ScrollRegion>);
    expect(screen.queryByRole('region', { name: 'Fits' })).not.toBeInTheDocument();
  });
});

describe('toasts', () => {
  it('when a confirmation shows, then it stays 20 s, its clock stops while hovered or focused, and a problem stays until dismissed', () => {
    vi.useFakeTimers();
    showToast('ok', 'Details saved.');
    showToast('danger', 'Could not copy.');
    vi.advanceTimersByTime(TOAST_VISIBLE_MS - 1000);
    pauseToasts();
    vi.advanceTimersByTime(60_000);
    expect(getToasts().map((t) => t.message)).toEqual(['Details saved.', 'Could not copy.']);
    resumeToasts();
    // At least a few seconds after the reader moves away, never gone the instant the pointer leaves.
    vi.advanceTimersByTime(4000);
    expect(getToasts()).toHaveLength(2);
    vi.advanceTimersByTime(1500);
    expect(getToasts().map((t) => t.message)).toEqual(['Could not copy.']);
    vi.advanceTimersByTime(10 * 60_000);
    expect(getToasts()).toHaveLength(1);
    dismissToast(getToasts()[0].id);
    expect(getToasts()).toHaveLength(0);
  });
});
