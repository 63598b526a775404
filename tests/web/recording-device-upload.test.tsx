import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Recording } from '@shared/schemas/recordings';
import { apiError, json, sessionHandler, sessionUser, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';

vi.mock('../../web/features/charts/components/uplot-chart', () => ({ default: () => <div data-testid="uplot-chart" /> }));

const ID = '7a7a7a7a-0000-4000-8000-000000000012';
const REC_ID = 'd1d1d1d1-0000-4000-8000-000000000012';
const nurse = sessionUser('nurse');
const found = ['Date', 'Time', 'SpO2', 'Pulse'];

const infant = {
  id: ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '6 wk 2 d', postmenstrualAge: '46+2 wk', chronologicalAge: '19 wk 1 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'],
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Cindermoor', location: { elevationM: 1780 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 1780, homePressureMmHg: 614.2, activeFlowLpm: 0.25, activeSetting: null, status: 'on_oxygen', flags: [],
  nurse: { id: nurse.id, name: nurse.name }, consultant: null, contacts: [], rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
} as InfantDetail;

const queued = {
  id: REC_ID, infantId: ID, status: 'queued', fileName: 'night.csv', sha256: 'ab'.repeat(32), byteSize: 2048,
  uploadedAt: '2026-10-25T07:00:00.000Z', uploadedBy: { id: nurse.id, name: nurse.name }, timeFormat: 'iso',
  startedAt: '2026-10-24T21:00:00.000Z', durationMinutes: 540, sampleCount: 3240, samplePeriodSec: 10, skippedRows: 0, analysisVersion: null, analysedAt: null,
} as Recording;

function stub(upload: (call: number) => Response, saved: unknown = null) {
  let calls = 0;
  const fetchMock = stubApi({
    'GET /api/session': sessionHandler('nurse'),
    [`GET /api/infants/${ID}`]: () => json(200, infant),
    [`GET /api/infants/${ID}/recordings/saved-mapping`]: () => json(200, { mapping: saved }),
    [`POST /api/infants/${ID}/recordings`]: () => upload(++calls),
    [`GET /api/recordings/${REC_ID}`]: () => json(200, queued),
  });
  const sent = () =>
    fetchMock.mock.calls
      .filter(([, init]) => init?.method === 'POST')
      .map(([, init]) => Object.fromEntries([...(init?.body as FormData).entries()].filter(([key]) => key !== 'file')));
  const lookups = () => fetchMock.mock.calls.map(([input]) => new URL(String(input), 'http://localhost')).filter((u) => u.pathname.endsWith('saved-mapping'));
  return { sent, lookups };
}

async function chooseAndSend() {
  const app = renderApp(`/infants/${ID}/recordings/new`);
  await screen.findByRole('heading', { level: 1, name: 'Upload an overnight recording: Juniper Ashdown' }, { timeout: 5000 });
  await app.user.upload(screen.getByLabelText('Recording file (CSV)'), new File(['Date;Time;SpO2;Pulse\n'], 'night.csv', { type: 'text/csv' }));
  await app.user.click(screen.getByRole('button', { name: 'Upload recording' }));
  return { ...app, step: await screen.findByRole('form', { name: 'Match the columns' }) };
}

const wrongColumns = () => apiError(400, 'wrong_columns', 'Not our columns.', { found, missing: ['timestamp', 'spo2', 'pulse'] });

describe('Uploading an oximeter’s own export', () => {
  it('when the file has Date and Time columns, then both are chosen; when the order is unclear, the line is shown and the order sent', async () => {
    const { sent } = stub((call) =>
      call === 1 ? wrongColumns()
        : call === 2 ? apiError(400, 'date_order_unclear', 'Line 6: 03/04/2026 21:00:00 could be day/month/year or month/day/year.', { found, line: ['6'] })
          : json(202, { id: REC_ID }));
    const { user, step, router } = await chooseAndSend();
    expect(within(step).getByRole('radio', { name: 'A date column and a time column' })).toBeChecked();
    expect(within(step).getByLabelText('Date')).toHaveValue('Date');
    expect(within(step).getByLabelText('Time of day')).toHaveValue('Time');
    expect(within(step).getByText('Leave empty for the family’s time zone (Europe/London). Clock changes are taken into account.')).toBeInTheDocument();
    await user.click(within(step).getByRole('button', { name: 'Upload with these columns' }));

    const alert = await screen.findByRole('alert');
    expect(alert).toHaveTextContent('Choose the date order: the dates in this file could be read day first or month first.');
    expect(alert).toHaveTextContent('Line 6: 03/04/2026 21:00:00 could be day/month/year or month/day/year.');
    const sameStep = screen.getByRole('form', { name: 'Match the columns' });
    expect(within(sameStep).getByLabelText('Date')).toHaveValue('Date');
    await user.selectOptions(within(sameStep).getByLabelText('Date order'), 'dmy');
    await user.type(within(sameStep).getByLabelText('Time zone of the oximeter’s clock'), 'UTC');
    await user.click(within(sameStep).getByRole('button', { name: 'Upload with these columns' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/recordings/${REC_ID}`));
    expect(sent()[1]).toEqual({ dateColumn: 'Date', timeColumn: 'Time', spo2Column: 'SpO2', pulseColumn: 'Pulse', timeFormat: 'auto' });
    expect(sent()[2]).toEqual({ dateColumn: 'Date', timeColumn: 'Time', spo2Column: 'SpO2', pulseColumn: 'Pulse', timeFormat: 'auto', dateOrder: 'dmy', timeZone: 'UTC' });
  });

  it('when a mapping was used before for these headers, then it is chosen again and said so', async () => {
    const { sent, lookups } = stub((call) => (call === 1 ? wrongColumns() : json(202, { id: REC_ID })),
      { dateColumn: 'Date', timeColumn: 'Time', spo2Column: 'SpO2', dateOrder: 'mdy', timeFormat: 'auto' });
    const { user, step, router } = await chooseAndSend();
    expect(lookups()[0].searchParams.get('headers')).toBe('Date\nTime\nSpO2\nPulse');
    expect(within(step).getByText('Chosen as for the last file with these columns. Check them before uploading.')).toBeInTheDocument();
    expect(within(step).getByLabelText('Date order')).toHaveValue('mdy');
    expect(within(step).getByLabelText('Pulse (optional)')).toHaveValue('');
    await user.click(within(step).getByRole('button', { name: 'Upload with these columns' }));
    await waitFor(() => expect(router.state.location.pathname).toBe(`/recordings/${REC_ID}`));
    expect(sent()[1]).toEqual({ dateColumn: 'Date', timeColumn: 'Time', spo2Column: 'SpO2', dateOrder: 'mdy', timeFormat: 'auto' });
  });

  it('when the person switches to one time column, then the date columns are not sent and the time column is required', async () => {
    const { sent } = stub((call) => (call === 1 ? wrongColumns() : json(202, { id: REC_ID })));
    const { user, step } = await chooseAndSend();
    await user.click(within(step).getByRole('radio', { name: 'One column' }));
    await user.click(within(step).getByRole('button', { name: 'Upload with these columns' }));
    expect(await within(step).findByText('Choose the column with the time')).toBeInTheDocument();
    await user.selectOptions(within(step).getByLabelText('Time'), 'Time');
    await user.selectOptions(within(step).getByLabelText('How the time is written'), 'local');
    await user.click(within(step).getByRole('button', { name: 'Upload with these columns' }));
    await waitFor(() => expect(sent()).toHaveLength(2));
    expect(sent()[1]).toEqual({ timestampColumn: 'Time', timeFormat: 'local', spo2Column: 'SpO2', pulseColumn: 'Pulse' });
  });
});
