import { configure, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { DEFAULT_POLICY_SETTINGS, type Policy } from '@shared/schemas/policy';
import { json, PROGRAMME_ID, sessionHandler, stubApi, type FakeRequest } from './support/fake-api';
import { renderApp } from './support/render-app';

configure({ asyncUtilTimeout: 5000 });

const policy: Policy = { programmeId: PROGRAMME_ID, version: 4, settings: DEFAULT_POLICY_SETTINGS, createdAt: '2026-11-20T09:30:00.000Z', createdBy: null };

describe('Programme settings: discharge checklist', { timeout: 20_000 }, () => {
  it('when opened, then every default item is listed with its source; a changed interval and a new item are sent with the rest unchanged', async () => {
    const puts: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler('admin'),
      'GET /api/policy': () => json(200, policy),
      'GET /api/policy/history': () => json(200, { items: [] }),
      'PUT /api/policy': (request) => {
        puts.push(request);
        return json(200, { ...policy, version: 5, settings: (request.body as Policy).settings });
      },
    });
    const { user } = renderApp('/admin/settings');
    const form = within(await screen.findByRole('form', { name: 'Programme settings' }));
    const section = within(form.getByRole('group', { name: 'Discharge checklist' }));
    const days = section.getByLabelText('First home visit proposed, days after discharge');
    expect(days).toHaveValue(1);
    expect(days).toHaveAccessibleDescription(/Default 1 day — common practice/);
    // Stored items start folded to one line each, with their source.
    expect(section.getAllByRole('button', { name: /^Edit item \d+$/ })).toHaveLength(DEFAULT_POLICY_SETTINGS.discharge.items.length);
    expect(section.getByText('Family trained to use the oxygen equipment')).toBeInTheDocument();
    await user.click(section.getByRole('button', { name: 'Edit item 1' }));
    const first = within(section.getByRole('group', { name: 'Item 1' }));
    expect(first.getByLabelText('What must be done')).toHaveValue('Family trained to use the oxygen equipment');
    expect(first.getByLabelText('Source')).toHaveValue(DEFAULT_POLICY_SETTINGS.discharge.items[0].source);
    expect(first.getByLabelText('The date it was done')).toBeChecked();
    expect(first.getByLabelText(/The family sees it/)).toBeChecked();

    await user.clear(days);
    await user.type(days, '2');
    await user.click(section.getByRole('button', { name: 'Add a checklist item' }));
    const added = within(section.getByRole('group', { name: `Item ${DEFAULT_POLICY_SETTINGS.discharge.items.length + 1}` }));
    await user.type(added.getByLabelText('What must be done'), 'Health visitor told');
    await user.type(added.getByLabelText('Source'), 'common practice');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    await waitFor(() => expect(puts).toHaveLength(1));
    const sent = (puts[0].body as Policy).settings.discharge;
    expect(sent.firstVisitDaysAfterDischarge).toBe(2);
    expect(sent.items.slice(0, -1)).toEqual(DEFAULT_POLICY_SETTINGS.discharge.items);
    expect(sent.items.at(-1)).toEqual({
      key: `item_${DEFAULT_POLICY_SETTINGS.discharge.items.length + 1}`, label: 'Health visitor told', group: 'follow_up', evidence: [],
      familySees: false, familyLabel: '', source: 'common practice',
    });
  });

  it('when a follow-up item is marked for the family, then the shared rule refuses it beside the box and nothing is sent', async () => {
    const puts: FakeRequest[] = [];
    stubApi({
      'GET /api/session': sessionHandler('admin'),
      'GET /api/policy': () => json(200, policy),
      'GET /api/policy/history': () => json(200, { items: [] }),
      'PUT /api/policy': (request) => { puts.push(request); return json(500); },
    });
    const { user } = renderApp('/admin/settings');
    const form = within(await screen.findByRole('form', { name: 'Programme settings' }));
    const index = DEFAULT_POLICY_SETTINGS.discharge.items.findIndex((i) => i.group === 'follow_up');
    await user.click(form.getByRole('button', { name: `Edit item ${index + 1}` }));
    const row = within(form.getByRole('group', { name: `Item ${index + 1}` }));
    await user.click(row.getByLabelText(/The family sees it/));
    await user.type(row.getByLabelText('In plain words for the family'), 'Your nurse is named');
    await user.click(form.getByRole('button', { name: 'Save as version 5' }));
    expect(await row.findAllByText('Families see only family training and home safety items')).not.toHaveLength(0);
    expect(puts).toHaveLength(0);
  });
});
