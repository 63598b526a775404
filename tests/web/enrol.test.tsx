import type { EnrolInfantInput } from '@shared/schemas/infants';
import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import { DEFAULT_POLICY_SETTINGS } from '@shared/schemas/policy';
import { apiError, json, makeUser, PROGRAMME_ID, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { currentUrl, renderApp } from './support/render-app';

const SITE = { id: '5e5e5e5e-0000-4000-8000-000000000001', name: "Larkmoor Regional Children's Hospital", elevationM: 95 };
const nurse = makeUser({ name: 'Ada Pennick', role: 'nurse' });
const consultant = makeUser({ name: 'Dr Ilse Varga', role: 'consultant' });
const INFANT_ID = '7a7a7a7a-0000-4000-8000-000000000001';
const policy = { programmeId: PROGRAMME_ID, version: 1, settings: DEFAULT_POLICY_SETTINGS, createdAt: null };

const enrolled = {
  id: INFANT_ID, name: 'Juniper Ashdown', givenName: 'Juniper', familyName: 'Ashdown', sex: 'female', birthDate: '2025-01-10',
  gestation: { weeks: 27, days: 3 }, correctedAge: '5 wk', postmenstrualAge: '43+2', chronologicalAge: '17 wk 0 d',
  birthWeightG: 910, weightKg: 2.4, weightDate: '2025-04-01', diagnoses: ['chronic_lung_disease'],
  site: SITE, hospital: { flowLpm: 0.5, source: 'cylinder', o2Percent: 100 },
  home: { address: '4 Kiln Lane, Cindermoor', location: { elevationM: 1780 }, source: 'concentrator', o2Percent: 95 },
  homeElevationM: 1780, homePressureMmHg: 614.2, activeFlowLpm: null, activeSetting: null, status: 'preparing', flags: [],
  nurse: { id: nurse.id, name: nurse.name }, consultant: { id: consultant.id, name: consultant.name }, contacts: [],
  rowVersion: 1, enrolledAt: '2025-04-02T09:00:00.000Z',
};

type Handler = (request: FakeRequest) => Response | Promise<Response>;

function stubEnrol(post: Handler) {
  const posts: FakeRequest[] = [];
  const fetchMock = stubApi({
    'GET /api/session': sessionHandler('coordinator'),
    'GET /api/sites': () => json(200, { items: [SITE] }),
    'GET /api/policy': () => json(200, policy),
    'GET /api/users': ({ url }) => json(200, { items: url.searchParams.get('role') === 'nurse' ? [nurse] : [consultant], total: 1 }),
    'POST /api/infants': (request) => {
      posts.push(request);
      return post(request);
    },
    [`GET /api/infants/${INFANT_ID}`]: () => apiError(500, 'internal', 'not needed here'),
  });
  return { posts, fetchMock };
}

type User = ReturnType<typeof renderApp>['user'];

async function fillBaby(user: User, weightKg = '2.4') {
  await user.type(await screen.findByLabelText('Given name'), 'Juniper');
  await user.type(screen.getByLabelText('Family name'), 'Ashdown');
  await user.selectOptions(screen.getByLabelText('Sex'), 'Female');
  await user.type(screen.getByLabelText('Birth date'), '2025-01-10');
  await user.type(screen.getByLabelText('Weeks'), '27');
  await user.type(screen.getByLabelText('Days'), '3');
  await user.type(screen.getByLabelText('Birth weight (g)'), '910');
  await user.clear(screen.getByLabelText('Weighed on'));
  await user.type(screen.getByLabelText('Weighed on'), '2025-04-01');
  await user.type(screen.getByLabelText('Current weight (kg)'), weightKg);
  await user.click(screen.getByLabelText('Chronic lung disease'));
}

async function fillHospital(user: User, flow = '0.5') {
  await user.selectOptions(await screen.findByLabelText('Hospital site'), SITE.id);
  await user.type(screen.getByLabelText('Cannula flow in hospital (L/min)'), flow);
}

async function fillHome(user: User, elevation = '1780') {
  await user.type(await screen.findByLabelText('Home address'), '4 Kiln Lane, Cindermoor');
  await user.type(screen.getByLabelText('Home elevation (m)'), elevation);
}

async function fillCare(user: User) {
  await user.selectOptions(await screen.findByLabelText('Home-care nurse'), nurse.id);
  await user.selectOptions(await screen.findByLabelText('Consultant'), consultant.id);
  await user.type(screen.getByLabelText('Name'), 'Mara Ashdown');
  await user.type(screen.getByLabelText('Relation to the baby'), 'mother');
  await user.type(screen.getByLabelText('Mobile number'), '+44 7700 900123');
  await user.click(screen.getByLabelText('Agrees to SMS'));
}

const next = (user: User) => user.click(screen.getByRole('button', { name: /^Next/ }));
const stepTitle = () => screen.getByRole('heading', { level: 2, name: /^Step \d of 5/ }).textContent;

async function fillAll(user: User) {
  await fillBaby(user);
  await next(user);
  await fillHospital(user);
  await next(user);
  await fillHome(user);
  await next(user);
  await fillCare(user);
  await next(user);
  await waitFor(() => expect(stepTitle()).toBe('Step 5 of 5: Check and save'));
}

// A five-step form typed key by key: on a loaded machine a run can pass the default 5 s, and a step's answer 1 s.
configure({ asyncUtilTimeout: 5000 });
describe('Enrol a baby', { timeout: 20_000 }, () => {
  it('when Next is pressed on an empty step, then the shared schema explains beside the fields and the step stays', async () => {
    stubEnrol(() => json(500));
    const { user } = renderApp('/enrol');
    await screen.findByLabelText('Given name');
    await next(user);
    expect(await screen.findByText('Enter the given name')).toBeInTheDocument();
    expect(screen.getByText('Enter the weight in kg')).toBeInTheDocument();
    expect(screen.getByText('Enter the birth weight in grams')).toBeInTheDocument();
    expect(screen.getByLabelText('Given name')).toHaveAttribute('aria-invalid', 'true');
    expect(stepTitle()).toBe('Step 1 of 5: Baby');
  });

  it('when going back and forth, then nothing typed is lost and the cylinder source is locked to 100 %', async () => {
    stubEnrol(() => json(500));
    const { user } = renderApp('/enrol');
    await fillBaby(user);
    await next(user);
    await fillHospital(user, '0.25');
    expect(screen.getByLabelText('Oxygen %')).toHaveValue(100);
    expect(screen.getByLabelText('Oxygen %')).toHaveAttribute('readonly');
    await user.click(screen.getByRole('button', { name: 'Back' }));
    expect(await screen.findByLabelText('Given name')).toHaveValue('Juniper');
    expect(screen.getByLabelText('Current weight (kg)')).toHaveValue(2.4);
    await next(user);
    expect(await screen.findByLabelText('Cannula flow in hospital (L/min)')).toHaveValue(0.25);
  });

  it('when weight, flow or elevation change, then the preview shows what the shared conversion gives', async () => {
    stubEnrol(() => json(500));
    const { user } = renderApp('/enrol');
    const preview = () => screen.getByRole('region', { name: 'Home setting preview' });
    const expected = (weightKg: number, flowLpm: number, elevationM: number) =>
      convertPrescription({
        weightKg,
        flowLpm,
        sourceO2Percent: 100,
        homeSourceO2Percent: 95,
        hospital: { elevationM: SITE.elevationM },
        home: { elevationM },
        flowmeterStepsLpm: DEFAULT_POLICY_SETTINGS.flowmeterStepsLpm,
        cannulaMaxFlowLpm: DEFAULT_POLICY_SETTINGS.cannulaMaxFlowLpm,
        pressureModel: DEFAULT_POLICY_SETTINGS.pressureModel,
      });
    const flowFigure = () => within(preview()).getByText('Flowmeter setting (rounded up)').nextElementSibling?.textContent;
    const fio2Figure = () => within(preview()).getByText('FiO2 needed at home').nextElementSibling?.textContent;

    await fillBaby(user, '2.4');
    expect(within(await screen.findByRole('region', { name: 'Home setting preview' })).getByText(/to see the preview/)).toBeInTheDocument();
    await next(user);
    await fillHospital(user, '0.5');
    await next(user);
    await fillHome(user, '1780');

    const first = expected(2.4, 0.5, 1780);
    await waitFor(() => expect(flowFigure()).toBe(`${first.home.roundedFlowLpm} L/min`));
    expect(fio2Figure()).toContain(first.home.targetFio2.toFixed(4));
    expect(within(preview()).getByText(/Proposal only — a consultant must approve it/)).toBeInTheDocument();

    await user.clear(screen.getByLabelText('Home elevation (m)'));
    await user.type(screen.getByLabelText('Home elevation (m)'), '2350');
    const higher = expected(2.4, 0.5, 2350);
    await waitFor(() => expect(fio2Figure()).toContain(higher.home.targetFio2.toFixed(4)));

    await user.click(screen.getByRole('button', { name: 'Back' }));
    await user.clear(await screen.findByLabelText('Cannula flow in hospital (L/min)'));
    await user.type(screen.getByLabelText('Cannula flow in hospital (L/min)'), '0.75');
    const moreFlow = expected(2.4, 0.75, 2350);
    await waitFor(() => expect(flowFigure()).toBe(`${moreFlow.home.roundedFlowLpm} L/min`));

    await user.click(screen.getByRole('button', { name: 'Back' }));
    await user.clear(await screen.findByLabelText('Current weight (kg)'));
    await user.type(screen.getByLabelText('Current weight (kg)'), '3.6');
    const heavier = expected(3.6, 0.75, 2350);
    await waitFor(() => expect(fio2Figure()).toContain(heavier.home.targetFio2.toFixed(4)));
    expect(heavier.home.targetFio2).not.toBeCloseTo(moreFlow.home.targetFio2, 4);
  });

  it('when the server answers 400 with details, then the form jumps to the first step with an error and keeps every value', async () => {
    stubEnrol(() =>
      apiError(400, 'validation_failed', 'Check the highlighted fields.', {
        'baby.givenName': ['This name has characters the register cannot store'],
        'contacts.0.mobile': ['This number cannot receive SMS'],
      }),
    );
    const { user } = renderApp('/enrol');
    await fillAll(user);
    await user.click(screen.getByRole('button', { name: 'Enrol baby' }));

    expect(await screen.findByText('This name has characters the register cannot store')).toBeInTheDocument();
    expect(stepTitle()).toBe('Step 1 of 5: Baby');
    expect(screen.getByLabelText('Given name')).toHaveValue('Juniper');
    expect(screen.getByLabelText('Given name')).toHaveAttribute('aria-invalid', 'true');

    await user.clear(screen.getByLabelText('Given name'));
    await user.type(screen.getByLabelText('Given name'), 'Juno');
    await user.click(screen.getByRole('button', { name: /Care team and family/ }));
    await waitFor(() => expect(stepTitle()).toBe('Step 4 of 5: Care team and family'));
    expect(screen.getByText('This number cannot receive SMS')).toBeInTheDocument();
    expect(screen.getByLabelText('Mobile number')).toHaveValue('+44 7700 900123');
  });

  it('when Enrol is double-clicked, then one request is sent with the form key and the record opens', async () => {
    let release: () => void = () => {};
    const { posts } = stubEnrol(
      () => new Promise<Response>((resolve) => {
        release = () => resolve(json(201, enrolled));
      }),
    );
    const { user, router } = renderApp('/enrol');
    await fillAll(user);
    await user.dblClick(screen.getByRole('button', { name: 'Enrol baby' }));
    await waitFor(() => expect(screen.getByRole('button', { name: 'Saving…' })).toBeDisabled());
    expect(posts).toHaveLength(1);
    const body = posts[0].body as EnrolInfantInput;
    expect(body.enrolKey).toMatch(/^[0-9a-f-]{36}$/);
    expect(body.baby).toMatchObject({ givenName: 'Juniper', weightKg: 2.4, gestation: { weeks: 27, days: 3 }, diagnoses: ['chronic_lung_disease'] });
    expect(body.hospital).toEqual({ siteId: SITE.id, flowLpm: 0.5, source: 'cylinder', o2Percent: 100 });
    expect(body.home).toEqual({ address: '4 Kiln Lane, Cindermoor', location: { elevationM: 1780 }, source: 'concentrator', o2Percent: 95 });
    expect(body.contacts[0]).toMatchObject({ name: 'Mara Ashdown', timeZone: 'Europe/London', language: 'en', consentSms: true });
    release();
    // The record's code loads lazily; under a busy machine that can take longer than waitFor's default second.
    await waitFor(() => expect(currentUrl(router)).toBe(`/infants/${INFANT_ID}`), { timeout: 5000 });
  });

  it('when steps are passed, then the step bar ticks them in words, the check step writes dates in words and language and zone are choices', async () => {
    const { posts } = stubEnrol(() => json(201, enrolled));
    const { user } = renderApp('/enrol');
    const bar = () => within(screen.getByRole('navigation', { name: 'Enrolment steps' }));
    await fillBaby(user);
    expect(bar().queryByText(/\(done\)/)).toBeNull();
    await next(user);
    await fillHospital(user);
    await next(user);
    // Read as text: jsdom's name calculation drops the spaces between the button's inline parts, a browser keeps them.
    await waitFor(() => expect(stepTitle()).toBe('Step 3 of 5: Home'));
    const steps = bar().getAllByRole('button');
    expect(steps.map((step) => step.textContent)).toEqual([
      'Step 1: Baby (done)', 'Step 2: Hospital setting (done)', '3Step 3: Home', '4Step 4: Care team and family', '5Step 5: Check and save',
    ]);
    expect(steps[2]).toHaveAttribute('aria-current', 'step');
    await fillHome(user);
    await next(user);
    await fillCare(user);
    const language = screen.getByRole('combobox', { name: /^Language/ });
    const zone = screen.getByRole('combobox', { name: /^Time zone/ });
    // The programme's zone is offered first; free text is no longer possible.
    expect(within(zone).getAllByRole('option')[0]).toHaveValue('Europe/London');
    expect(within(zone).getByRole('option', { name: 'America / Buenos Aires' })).toBeInTheDocument();
    expect(within(language).getAllByRole('option')[0]).toHaveValue('en');
    expect(within(language).getByRole('option', { name: 'Welsh — messages in English' })).toHaveValue('cy');
    await user.selectOptions(language, 'cy');
    await user.selectOptions(zone, 'Europe/Dublin');
    await next(user);
    await waitFor(() => expect(stepTitle()).toBe('Step 5 of 5: Check and save'));
    expect(screen.getByText('10 Jan 2025')).toBeInTheDocument();
    expect(screen.getByText('2.4 kg on 1 Apr 2025')).toBeInTheDocument();
    expect(screen.queryByText(/2025-0/)).toBeNull();
    await user.click(screen.getByRole('button', { name: 'Enrol baby' }));
    await waitFor(() => expect(posts).toHaveLength(1));
    expect((posts[0].body as EnrolInfantInput).contacts[0]).toMatchObject({ language: 'cy', timeZone: 'Europe/Dublin' });
  });
});
