import { screen, waitFor, within } from '@testing-library/react';
import type { QueryClient, QueryKey } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import type { Role } from '@shared/auth/roles';
import { caseloadRequestFor } from '@shared/http/caseload-request';
import type { InfantSummary } from '@shared/schemas/infants';
import { createAppQueryClient } from '../../web/app/providers';
import type { PageLoader } from '../../web/app/loaders/page-loader';
import { loader as adminHomeLoader } from '../../web/app/routes/admin-home.loader';
import { loader as caseloadLoader } from '../../web/app/routes/caseload.loader';
import { loader as familyHomeLoader } from '../../web/app/routes/family-home.loader';
import { loader as infantRecordLoader } from '../../web/app/routes/infant-record.loader';
import { loader as nurseHomeLoader } from '../../web/app/routes/nurse-home.loader';
import { loader as overviewLoader } from '../../web/app/routes/overview.loader';
import { familyKeys } from '../../web/features/family/api/family-keys';
import { healthKeys } from '../../web/features/health/api/get-health';
import { infantKeys } from '../../web/features/infants/api/infant-keys';
import { monitoringKeys } from '../../web/features/monitoring/api/monitoring-keys';
import { myDayKeys } from '../../web/features/my-day/api/my-day-keys';
import { overviewKeys } from '../../web/features/overview/api/overview-keys';
import { sessionKeys } from '../../web/features/session/api/session-keys';
import { json, sessionHandler, stubApi } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const BABY = '7a7a7a7a-0000-4000-8000-000000000001';
const row: InfantSummary = {
  id: BABY, name: 'Juniper Ashdown', correctedAge: '6 wk 2 d', homeElevationM: 1780, homePressureMmHg: 614.2,
  activeFlowLpm: 0.125, status: 'on_oxygen', nurse: null, consultant: null, flags: [],
};

/** Every API path a loader may ask for, each answering enough for its schema; the calls are recorded. */
function stubAll(role: Role | null) {
  const calls: URL[] = [];
  const record = (answer: () => Response) => ({ url }: { url: URL }) => {
    calls.push(url);
    return answer();
  };
  stubApi({
    'GET /api/session': sessionHandler(role),
    'GET /api/infants': record(() => json(200, { items: [row], total: 1, nextCursor: null, prevCursor: null })),
    [`GET /api/infants/${BABY}`]: record(() => json(404, { error: { code: 'not_found', message: 'No such baby' } })),
    [`GET /api/infants/${BABY}/prescriptions`]: record(() => json(200, { items: [] })),
    'GET /api/policy': record(() => json(404, { error: { code: 'not_found', message: 'None' } })),
    'GET /api/overview': record(() => json(404, { error: { code: 'not_found', message: 'None' } })),
    'GET /api/health/ready': record(() => json(404, { error: { code: 'not_found', message: 'None' } })),
    'GET /api/my-day': record(() => json(404, { error: { code: 'not_found', message: 'None' } })),
  });
  return calls;
}

async function runLoader(make: PageLoader, path: string, params: Record<string, string> = {}): Promise<QueryClient> {
  const queryClient = createAppQueryClient({ retry: false });
  const args = { request: new Request(`http://localhost${path}`), params, context: undefined } as unknown as LoaderFunctionArgs;
  await make(queryClient)(args);
  return queryClient;
}

/** The keys of every query the loader started, the session aside. */
const startedKeys = (queryClient: QueryClient): QueryKey[] =>
  queryClient.getQueryCache().getAll().map((q) => q.queryKey).filter((key) => key[0] !== sessionKeys.all[0]);

describe('Route loaders', () => {
  it('when a coordinator opens a caseload link, then its page is asked for under the key the list reads, without a consultant-only scope', async () => {
    const calls = stubAll('coordinator');
    const queryClient = await runLoader(caseloadLoader, '/caseload?sort=-elevation&status=on_oxygen&scope=mine&page=2&cursor=after-1');
    const keys = startedKeys(queryClient);
    expect(keys).toHaveLength(1);
    expect(keys[0].slice(0, 2)).toEqual(infantKeys.lists());
    expect(keys[0][2]).toMatchObject({ sort: '-elevation', status: 'on_oxygen', page: 2, cursor: 'after-1', pageSize: 25 });
    expect(keys[0][2]).not.toHaveProperty('scope', 'mine');
    await waitFor(() => expect(calls).toHaveLength(1));
    expect(calls[0].pathname).toBe('/api/infants');
    expect(calls[0].searchParams.get('sort')).toBe('-elevation');
    expect(calls[0].searchParams.get('scope')).toBeNull();
  });

  it('when the server names the caseload request in the page (shared/http/caseload-request.ts), then it is the very request the loader makes, for every role that opens the caseload', async () => {
    for (const address of ['/caseload', '/caseload?sort=-elevation&status=on_oxygen&page=2&cursor=after-1', '/caseload?q=Ash%20Row&pageSize=50&flag=number_unreadable', '/caseload?pageSize=oops&sort=nope']) {
      for (const role of ['coordinator', 'consultant', 'nurse'] as const) {
        const calls = stubAll(role);
        await runLoader(caseloadLoader, address);
        await waitFor(() => expect(calls).toHaveLength(1));
        expect(`${calls[0].pathname}${calls[0].search}`, `${role} ${address}`).toBe(caseloadRequestFor(new URL(address, 'http://localhost').searchParams));
      }
    }
  });

  it('when a consultant opens "only mine", then the scope is part of the key and the request', async () => {
    const calls = stubAll('consultant');
    const queryClient = await runLoader(caseloadLoader, '/caseload?scope=mine');
    expect(startedKeys(queryClient)[0][2]).toMatchObject({ scope: 'mine' });
    await waitFor(() => expect(calls[0]?.searchParams.get('scope')).toBe('mine'));
  });

  it('when a family account or a signed-out visitor follows a caseload link, then the loader asks the API for nothing', async () => {
    for (const role of ['family', null] as const) {
      const calls = stubAll(role);
      const queryClient = await runLoader(caseloadLoader, '/caseload');
      expect(startedKeys(queryClient)).toEqual([]);
      expect(calls).toEqual([]);
    }
  });

  it('when a baby record is opened, then the baby, its versions and the SpO2 targets are asked for under the record\'s keys', async () => {
    const calls = stubAll('nurse');
    const queryClient = await runLoader(infantRecordLoader, `/infants/${BABY}`, { id: BABY });
    expect(startedKeys(queryClient)).toEqual(
      expect.arrayContaining([infantKeys.detail(BABY), infantKeys.prescriptions(BABY), monitoringKeys.targets()]),
    );
    expect(startedKeys(queryClient)).toHaveLength(3);
    await waitFor(() => expect(calls.map((u) => u.pathname).sort()).toEqual(['/api/infants/' + BABY, `/api/infants/${BABY}/prescriptions`, '/api/policy'].sort()));
  });

  it('when a family account follows a record link, then nothing is asked for', async () => {
    const calls = stubAll('family');
    const queryClient = await runLoader(infantRecordLoader, `/infants/${BABY}`, { id: BABY });
    expect(startedKeys(queryClient)).toEqual([]);
    expect(calls).toEqual([]);
  });

  it('when each role opens its start page, then that page\'s own query is started', async () => {
    const cases: [PageLoader, string, Role, QueryKey[]][] = [
      [adminHomeLoader, '/admin', 'admin', [overviewKeys.mine(), healthKeys.current()]],
      [overviewLoader, '/coordinator', 'coordinator', [overviewKeys.mine()]],
      [overviewLoader, '/consultant', 'consultant', [overviewKeys.mine()]],
      [nurseHomeLoader, '/nurse', 'nurse', [myDayKeys.today()]],
      [familyHomeLoader, '/family', 'family', [familyKeys.babies()]],
    ];
    for (const [make, path, role, keys] of cases) {
      stubAll(role);
      const queryClient = await runLoader(make, path);
      expect(startedKeys(queryClient), path).toEqual(keys);
    }
  });

  it('when a nurse follows a link to the coordinator\'s start page, then no overview is read for them', async () => {
    const calls = stubAll('nurse');
    const queryClient = await runLoader(overviewLoader, '/coordinator');
    expect(startedKeys(queryClient)).toEqual([]);
    expect(calls).toEqual([]);
  });

  it('when the caseload page opens, then it shows the list the loader asked for, asked once', async () => {
    const calls = stubAll('coordinator');
    const { queryClient } = renderApp('/caseload?sort=-elevation');
    const table = await screen.findByRole('table');
    expect(within(table).getByRole('link', { name: 'Juniper Ashdown' })).toHaveAttribute('href', `/infants/${BABY}`);
    expect(calls.filter((u) => u.pathname === '/api/infants')).toHaveLength(1);
    expect(queryClient.getQueryCache().findAll({ queryKey: infantKeys.lists() })).toHaveLength(1);
  });

  it('when the session has ended, then the caseload link lands on sign-in with the page to come back to', async () => {
    const calls = stubAll(null);
    const { router } = renderApp('/caseload');
    expect(await screen.findByRole('heading', { name: /sign in/i })).toBeInTheDocument();
    expect(currentUrl(router)).toBe('/sign-in?next=%2Fcaseload');
    expect(calls).toEqual([]);
  });
});
