import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Recording } from '@shared/schemas/recordings';
import { apiError, json, sessionHandler, sessionUser, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

vi.mock('../../web/features/charts/components/uplot-chart', () => ({ default: () => <div data-testid="uplot-chart" /> }));

const ID = '7a7a7a7a-0000-4000-8000-000000000011';
const REC_ID = 'd1d1d1d1-0000-4000-8000-000000000011';
const nurse = sessionUser('nurse');

const infant: InfantDetail = {
  id: ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '6 wk 2 d', postmenstrualAge: '46+2 wk', chronologicalAge: '19 wk 1 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'],
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Cindermoor', location: { elevationM: 1780 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 1780, homePressureMmHg: 614.2, activeFlowLpm: 0.25, activeSetting: null, status: 'on_oxygen', flags: [],
  nurse: { id: nurse.id, name: nurse.name }, consultant: null, contacts: [], rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
};

const queued: Recording = {
  id: REC_ID, infantId: ID, status: 'queued', fileName: 'night.csv', sha256: 'ab'.repeat(32), byteSize: 2048,
  uploadedAt: '2025-04-10T07:00:00.000Z', uploadedBy: { id: nurse.id, name: nurse.name }, timeFormat: 'iso',
  startedAt: '2025-04-09T20:00:00.000Z', durationMinutes: 600, sampleCount: 36000, samplePeriodSec: 1, skippedRows: 0,
  analysisVersion: null, analysedAt: null,
};

const csv = (name = 'night.csv', text = 'timestamp,spo2,pulse\n2025-04-09T20:00:00Z,96,140\n') => new File([text], name, { type: 'text/csv' });

function stubUpload(answer: (request: FakeRequest, call: number) => Response | Promise<Response>) {
  let calls = 0;
  const fetchMock = stubApi({
    'GET /api/session': sessionHandler('nurse'),
    [`GET /api/infants/${ID}`]: () => json(200, infant),
    [`POST /api/infants/${ID}/recordings`]: (request) => answer(request, ++calls),
    [`GET /api/recordings/${REC_ID}`]: () => json(200, queued),
  });
  // The fake API reads JSON bodies only; the multipart form is taken from the fetch call itself.
  const forms = () =>
    fetchMock.mock.calls
      .filter(([, init]) => init?.method === 'POST')
      .map(([, init]) => ({ form: init?.body as FormData, headers: new Headers(init?.headers) }));
  return { forms };
}

async function openAndChoose(file = csv()) {
  const app = renderApp(`/infants/${ID}/recordings/new`);
  await screen.findByRole('heading', { level: 1, name: 'Upload an overnight recording: Juniper Ashdown' }, { timeout: 5000 });
  await app.user.upload(screen.getByLabelText('Recording file (CSV)'), file);
  return app;
}

describe('Uploading an overnight recording', () => {
  it('when the page opens, then our format and the 20 MB limit are stated', async () => {
    stubUpload(() => json(202, { id: REC_ID }));
    renderApp(`/infants/${ID}/recordings/new`);
    expect(await screen.findByText('One night, up to 20 MB.', {}, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.getByText('timestamp,spo2,pulse')).toBeInTheDocument();
    expect(screen.getByLabelText('Recording file (CSV)')).toHaveAttribute('accept', '.csv,text/csv');
  });

  it('when the upload is accepted, then the file goes as multipart with the CSRF token and the recording page opens', async () => {
    let release: () => void = () => {};
    const { forms } = stubUpload(() => new Promise((resolve) => { release = () => resolve(json(202, { id: REC_ID })); }));
    const { user, router } = await openAndChoose();
    await user.click(screen.getByRole('button', { name: 'Upload recording' }));
    // While the file is on its way the button cannot be pressed again.
    expect(await screen.findByRole('button', { name: 'Uploading…' })).toBeDisabled();
    release();
    expect(await screen.findByRole('heading', { level: 1, name: 'Overnight recording: Juniper Ashdown' }, { timeout: 5000 })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe(`/recordings/${REC_ID}`);
    expect(screen.getByText('Recording uploaded. It is being analysed.')).toBeInTheDocument();
    const [{ form, headers }] = forms();
    expect(headers.get('X-CSRF-Token')).toBe('csrf-1');
    expect((form.get('file') as File).name).toBe('night.csv');
    expect([...form.keys()]).toEqual(['file']);
  });

  it('when the columns are not ours, then a matching step offers the found headers and re-sends the same file with the choices', async () => {
    const found = ['Time (s)', 'SpO2 %', 'PR bpm', 'Alarm'];
    const { forms } = stubUpload((_request, call) =>
      call === 1
        ? apiError(400, 'wrong_columns', 'The file’s columns are not in the Nestflow recording format.', { found, missing: ['timestamp', 'spo2', 'pulse'] })
        : json(202, { id: REC_ID }),
    );
    const file = csv('export.csv', 'Time (s),SpO2 %,PR bpm,Alarm\n0,97,140,\n');
    const { user, router } = await openAndChoose(file);
    await user.click(screen.getByRole('button', { name: 'Upload recording' }));

    const step = await screen.findByRole('form', { name: 'Match the columns' });
    const time = within(step).getByLabelText('Time');
    expect(within(time).getAllByRole('option').map((o) => o.textContent)).toEqual(['Choose a column', ...found]);
    expect(within(step).getByLabelText('SpO2 (%)')).toHaveValue('SpO2 %');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();

    await user.selectOptions(time, 'Time (s)');
    await user.selectOptions(within(step).getByLabelText('Pulse (optional)'), 'PR bpm');
    await user.selectOptions(within(step).getByLabelText('Device status (optional)'), '');
    await user.selectOptions(within(step).getByLabelText('How the time is written'), 'seconds');
    await user.click(within(step).getByRole('button', { name: 'Upload with these columns' }));

    await waitFor(() => expect(router.state.location.pathname).toBe(`/recordings/${REC_ID}`));
    const second = forms()[1].form;
    const sent = second.get('file') as File;
    expect(sent.name).toBe('export.csv');
    expect(await sent.text()).toBe(await file.text());
    expect(Object.fromEntries([...second.entries()].filter(([key]) => key !== 'file'))).toEqual({
      timestampColumn: 'Time (s)', spo2Column: 'SpO2 %', pulseColumn: 'PR bpm', timeFormat: 'seconds',
    });
  });

  it('when one column is chosen twice, then the shared rule stops the re-send and says which', async () => {
    const { forms } = stubUpload(() => apiError(400, 'wrong_columns', 'Not our columns.', { found: ['a', 'b'], missing: ['timestamp'] }));
    const { user } = await openAndChoose();
    await user.click(screen.getByRole('button', { name: 'Upload recording' }));
    const step = await screen.findByRole('form', { name: 'Match the columns' });
    await user.selectOptions(within(step).getByLabelText('Time'), 'a');
    await user.selectOptions(within(step).getByLabelText('SpO2 (%)'), 'a');
    await user.click(within(step).getByRole('button', { name: 'Upload with these columns' }));
    expect(await within(step).findByText('The same column is already chosen for Time')).toBeInTheDocument();
    expect(forms()).toHaveLength(1);
  });

  it.each([
    ['too_large', 413, 'This file is larger than 20 MB. Check that it is a single night’s export.'],
    ['not_csv', 415, 'This is not a CSV text file. Export the recording as CSV, saved as UTF-8, and choose that file.'],
    ['too_short', 400, 'This recording is too short to analyse (fewer than 60 readings).'],
  ])('when the server answers %s, then a plain message says what to do and the page stays', async (code, status, message) => {
    stubUpload(() => apiError(status, code, `Server says ${code}.`));
    const { user, router } = await openAndChoose();
    await user.click(screen.getByRole('button', { name: 'Upload recording' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(message);
    expect(router.state.location.pathname).toBe(`/infants/${ID}/recordings/new`);
    expect(screen.getByRole('button', { name: 'Upload recording' })).toBeEnabled();
  });

  it('when the CSV is malformed, then the line is named', async () => {
    stubUpload(() => apiError(400, 'malformed_csv', 'The file is not valid CSV. Unclosed quote at line 12.', { line: ['12'] }));
    const { user } = await openAndChoose();
    await user.click(screen.getByRole('button', { name: 'Upload recording' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('This file is not valid CSV (line 12).');
  });

  it('when the chosen file is over 20 MB, then it is refused before anything is sent', async () => {
    const { forms } = stubUpload(() => json(202, { id: REC_ID }));
    const big = csv('three-nights.csv');
    Object.defineProperty(big, 'size', { value: 21 * 1024 * 1024 });
    const { user } = await openAndChoose(big);
    await user.click(screen.getByRole('button', { name: 'Upload recording' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('This file is 21.0 MB; the most one recording may be is 20 MB.');
    expect(forms()).toHaveLength(0);
  });
});
