import { screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import type { InfantDetail } from '@shared/schemas/infants';
import type { Recording, RecordingTrace } from '@shared/schemas/recordings';
import { apiError, json, PROGRAMME_ID, sessionHandler, sessionUser, stubApi } from './support/fake-api';
import { renderApp } from './support/render-app';
import { getToasts, showToast } from '../../web/components/ui/toast-store';
import { ANALYSED_TOAST, ANALYSING_TOAST } from '../../web/features/recordings/api/analysing-toast';

// jsdom has no canvas: the uPlot wrapper is replaced, and what the chart says is checked in its caption and table.
vi.mock('../../web/features/charts/components/uplot-chart', () => ({ default: () => <div data-testid="uplot-chart" /> }));

const ID = '7a7a7a7a-0000-4000-8000-000000000021';
const REC_ID = 'd1d1d1d1-0000-4000-8000-000000000021';
const nurse = sessionUser('nurse');

const infant = (diagnoses: InfantDetail['diagnoses'] = ['chronic_lung_disease']): InfantDetail => ({
  id: ID, name: 'Wren Thackeray', givenName: 'Wren', familyName: 'Thackeray', sex: 'male', birthDate: '2025-01-10',
  gestation: { weeks: 26, days: 5 }, correctedAge: '8 wk', postmenstrualAge: '48 wk', chronologicalAge: '21 wk',
  birthWeightG: 820, weightKg: 3.1, weightDate: '2025-04-01', diagnoses,
  site: { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '2 Mill Row, Emberly', location: { elevationM: 40 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 40, homePressureMmHg: 756.4, activeFlowLpm: 0.25, activeSetting: null, status: 'on_oxygen', flags: [],
  nurse: { id: nurse.id, name: nurse.name }, consultant: null, contacts: [], rowVersion: 3, enrolledAt: '2025-04-02T09:00:00.000Z',
});

const base: Recording = {
  id: REC_ID, infantId: ID, status: 'queued', fileName: 'wren-night.csv', sha256: '3f'.repeat(32), byteSize: 1_048_576,
  uploadedAt: '2025-04-10T07:00:00.000Z', uploadedBy: { id: nurse.id, name: nurse.name }, timeFormat: 'iso',
  startedAt: '2025-04-09T20:00:00.000Z', durationMinutes: 598, sampleCount: 35880, samplePeriodSec: 1, skippedRows: 2,
  analysisVersion: null, analysedAt: null,
};
const summary = {
  validMinutes: 571.5, meanSpo2: 95.84, medianSpo2: 96, minSpo2: 81, pctBelow90: 1.23, pctBelow92: 2.5, pctBelow93: 4.1,
  odi3: 1.4, odi4: 0.5, meanPulse: 138.6, judged: true, minValidMinutes: 300, minEventSeconds: 10,
};
const done: Recording = { ...base, status: 'done', analysisVersion: 'nestflow-oximetry-1.0.0', analysedAt: '2025-04-10T07:00:05.000Z', summary };

const trace: RecordingTrace = {
  points: [{ tSec: 0, spo2Min: 95, spo2Mean: 96, pulseMean: 142 }, { tSec: 18, spo2Min: null, spo2Mean: null, pulseMean: null }, { tSec: 36, spo2Min: 84, spo2Mean: 90, pulseMean: 151.5 }],
  events: [
    { startSec: 3605, endSec: 3623, nadir: 86, deep: true },
    { startSec: 7200, endSec: 7212, nadir: 91, deep: false },
  ],
  threshold: 90,
};

function stubRecording(answers: Recording[], diagnoses?: InfantDetail['diagnoses']) {
  let calls = 0;
  stubApi({
    'GET /api/session': sessionHandler('consultant'),
    [`GET /api/recordings/${REC_ID}`]: () => json(200, answers[Math.min(calls++, answers.length - 1)]),
    [`GET /api/recordings/${REC_ID}/trace`]: () => json(200, trace),
    [`GET /api/infants/${ID}`]: () => json(200, infant(diagnoses)),
    'GET /api/policy': () => json(200, { programmeId: PROGRAMME_ID, version: 4, settings: DEFAULT_POLICY_SETTINGS, createdAt: null }),
  });
  return { calls: () => calls };
}

const opened = () => screen.findByRole('heading', { level: 1, name: 'Overnight recording: Wren Thackeray' }, { timeout: 5000 });

describe('Recording page', () => {
  it('when the analysis is still running, then the page says so and shows the figures by itself once done', async () => {
    const { calls } = stubRecording([base, done]);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    expect(screen.getAllByText('Waiting to be analysed').length).toBeGreaterThan(0);
    expect(screen.queryByRole('heading', { name: 'Summary' })).not.toBeInTheDocument();

    const summaryCard = (await screen.findByRole('heading', { name: 'Summary' }, { timeout: 5000 })).closest('section') as HTMLElement;
    expect(calls()).toBe(2);
    expect(await within(summaryCard).findByText('Meets the overnight target')).toBeInTheDocument();
    expect(within(summaryCard).getByText(/Target: mean SpO2 at least 93 % and less than 5 % of valid time below 90 %/)).toBeInTheDocument();
    const figure = (label: string) => within(summaryCard).getByText(label).nextElementSibling;
    expect(figure('Valid time (h:mm)')).toHaveTextContent('9:32');
    expect(figure('Mean SpO2')).toHaveTextContent('95.8 %');
    expect(figure('Median SpO2')).toHaveTextContent('96.0 %');
    expect(figure('Lowest SpO2')).toHaveTextContent('81.0 %');
    expect(figure('Time below 90 %')).toHaveTextContent('1.2 %');
    expect(figure('Time below 92 %')).toHaveTextContent('2.5 %');
    expect(figure('Time below 93 %')).toHaveTextContent('4.1 %');
    expect(figure('ODI3')).toHaveTextContent('1.4 per hour');
    expect(figure('ODI4')).toHaveTextContent('0.5 per hour');
    expect(figure('Mean pulse')).toHaveTextContent('139 /min');

    // It stops asking once the analysis is done.
    await new Promise((resolve) => setTimeout(resolve, 2500));
    expect(calls()).toBe(2);
  }, 15_000);

  it('when the baby has pulmonary hypertension and the mean is under its target, then the page says which part is missed', async () => {
    stubRecording([{ ...done, summary: { ...summary, meanSpo2: 94.6 } }], ['chronic_lung_disease', 'pulmonary_hypertension']);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    expect(await screen.findByText('Below the overnight target: mean SpO2 below 95 %')).toBeInTheDocument();
    expect(screen.getByText(/at least 95 % \(pulmonary hypertension\)/)).toBeInTheDocument();
  });

  it('when the study is too short to judge, then the headline says exactly that and not "below target"', async () => {
    // a 1-hour study with low figures: only the length fails it (Urschitz 2003: studies under 5 h excluded)
    stubRecording([{ ...done, summary: { ...summary, validMinutes: 60, meanSpo2: 91, pctBelow90: 9, judged: false } }]);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    expect(await screen.findByText(/Too short to judge: 1 h of valid recording, at least 5 h needed/)).toBeInTheDocument();
    expect(screen.queryByText(/Below the overnight target/)).not.toBeInTheDocument();
  });

  it('when the time below 90 % is too long, then that is named', async () => {
    stubRecording([{ ...done, summary: { ...summary, pctBelow90: 7.5 } }]);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    expect(await screen.findByText('Below the overnight target: 5 % or more of the time below 90 %')).toBeInTheDocument();
  });

  it('when the trace loads, then the chart has a caption with the figures and every event is listed in a table', async () => {
    stubRecording([done]);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    const table = await screen.findByRole('table', { name: 'Desaturation events, in time order' });
    const rows = within(table).getAllByRole('row').slice(1).map((row) => within(row).getAllByRole('cell').map((cell) => cell.textContent));
    const clock = (iso: string) => new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit', second: '2-digit', hourCycle: 'h23' }).format(new Date(iso));
    expect(rows).toEqual([
      [clock('2025-04-09T21:00:05Z'), '18 s', '86 %', 'Yes'],
      [clock('2025-04-09T22:00:00Z'), '12 s', '91 %', 'No'],
    ]);
    expect(screen.getByRole('heading', { name: 'Desaturation events (2)' })).toBeInTheDocument();
    const [caption, pulse] = screen.getAllByRole('figure');
    expect(pulse).toHaveTextContent('Pulse over 9:58 h: mean 139 /min; plotted means from 142 /min to 152 /min, on the same time axis as the SpO2 chart.');
    expect(screen.getByRole('heading', { name: 'Pulse through the night' })).toBeInTheDocument();
    expect(caption).toHaveTextContent(/SpO2 over 9:58 h: mean 95\.8 %, lowest 81\.0 %, 1\.2 % of valid time below 90 %, 2 desaturation events/);
    expect(caption).toHaveTextContent('1 with a fall of 4 points or more');
    expect(await screen.findAllByTestId('uplot-chart')).toHaveLength(2);
  });

  it('when the file is shown, then its SHA-256 is shortened with a copy button, and who uploaded it and the analysis version are given', async () => {
    stubRecording([done]);
    const { user } = renderApp(`/recordings/${REC_ID}`);
    await opened();
    const facts = screen.getByRole('heading', { name: 'File and analysis' }).closest('section') as HTMLElement;
    expect(within(facts).getByText('wren-night.csv (1.0 MB)')).toBeInTheDocument();
    expect(within(facts).getByText(`${'3f'.repeat(6)}…`)).toBeInTheDocument();
    expect(within(facts).getByText(/nestflow-oximetry-1\.0\.0/)).toBeInTheDocument();
    expect(within(facts).getByText(new RegExp(`by ${nurse.name}`))).toBeInTheDocument();
    await user.click(within(facts).getByRole('button', { name: 'Copy the full SHA-256' }));
    // user-event stands in for the system clipboard.
    expect(await navigator.clipboard.readText()).toBe('3f'.repeat(32));
    expect(await screen.findByText('SHA-256 copied.')).toBeInTheDocument();
  });

  it('when the analysis failed, then the reason is shown and no figures are', async () => {
    stubRecording([{ ...base, status: 'failed', failureReason: 'no valid samples after artefact removal' }]);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    expect(screen.getByRole('alert')).toHaveTextContent('This recording could not be analysed: no valid samples after artefact removal');
    expect(screen.queryByRole('heading', { name: 'Summary' })).not.toBeInTheDocument();
  });

  it('when the recording is not in the programme, then a readable not-found page is shown', async () => {
    stubApi({
      'GET /api/session': sessionHandler('nurse'),
      [`GET /api/recordings/${REC_ID}`]: () => apiError(404, 'not_found', 'No such recording.'),
    });
    renderApp(`/recordings/${REC_ID}`);
    expect(await screen.findByRole('heading', { name: 'No such recording in your records' }, { timeout: 5000 })).toBeInTheDocument();
  });

  it('when a family account follows a recording link, then the page is not offered', async () => {
    stubApi({ 'GET /api/session': sessionHandler('family') });
    renderApp(`/recordings/${REC_ID}`);
    expect(await screen.findByRole('heading', { name: 'Not part of your work' }, { timeout: 5000 })).toBeInTheDocument();
  });

  it('when the results appear after an upload, then "being analysed" goes and a message says the results are here', async () => {
    showToast('ok', ANALYSING_TOAST);
    stubRecording([base, done]);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    expect(screen.getByText(ANALYSING_TOAST)).toBeInTheDocument();
    await screen.findByRole('heading', { name: 'Summary' }, { timeout: 5000 });
    expect(await screen.findByText(ANALYSED_TOAST)).toBeInTheDocument();
    expect(screen.queryByText(ANALYSING_TOAST)).not.toBeInTheDocument();
    expect(getToasts().map((t) => t.message)).toEqual([ANALYSED_TOAST]);
  });

  it('when a finished recording is opened with no upload message showing, then no message is added', async () => {
    stubRecording([done]);
    renderApp(`/recordings/${REC_ID}`);
    await opened();
    await screen.findByRole('heading', { name: 'Summary' });
    expect(getToasts()).toEqual([]);
  });
});
