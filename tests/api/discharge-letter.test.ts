import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { flowInWords } from '@shared/family/care-text';
import { LETTER_CAUTIONS } from '@shared/discharge/letter-text';
import { letterSentSchema } from '@shared/schemas/discharge';
import { fixedClock } from '../../server/lib/clock';
import { createTestContext, type TestContext } from '../helpers/test-app';
import type { Agent } from '../helpers/agents';
import { approvedBaby, post } from '../helpers/approved-baby';
import { tickAll } from '../helpers/discharge';
import { pdfAttachment, pdfBody, readPdf } from '../helpers/pdf';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext({}, { clock: fixedClock('2026-12-03T10:00:00Z') });
});
afterAll(() => ctx.close());

const download = async (agent: Agent, id: string) => {
  const res = await agent.get(`/api/infants/${id}/discharge-letter.pdf`).buffer(true).parse(pdfBody).expect(200);
  return { res, ...(await readPdf(res.body as Buffer)) };
};

describe('GET /api/infants/:id/discharge-letter.pdf', () => {
  it('when the baby is discharged, then the letter gives the approved setting in numbers and words, the targets, the follow-up and who to call', async () => {
    const { infant, coord, rx, clinic } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id);
    await post(coord, `/api/infants/${infant.id}/discharge`, { date: '2026-12-08' }).expect(200);
    const { res, text, info } = await download(coord, infant.id);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="discharge-letter-test-baby-[a-z0-9]+-2026-12-03\.pdf"$/);
    expect(info).toMatch(/Tagged:\s+yes/);
    expect(text).toContain('For the family doctor and the community team');
    expect(text).toContain(`${infant.givenName} ${infant.familyName}`);
    expect(text).toContain('Discharge date: 8 Dec 2026.');
    expect(text).toContain(`${Number(rx.approvedFlowLpm.toFixed(3))} L/min (${flowInWords(rx.approvedFlowLpm)})`);
    expect(text).toContain(`Approved by ${clinic.people.consultant.name}`);
    // The four cautions wherever a setting is shown.
    for (const caution of LETTER_CAUTIONS) expect(text).toContain(caution.slice(0, 40));
    // Programme defaults (shared/schemas/policy.ts): overnight mean >= 93 % (TSANZ 2020; BTS 2009), <= 5 % of the
    // night below 90 %, a spot reading <= 90 % is low (ATS 2019).
    expect(text).toContain('Overnight: mean SpO2 93% or more, with no more than 5% of the night below 90%.');
    expect(text).toContain('A steady spot reading of 90% or less is low.');
    // First visit: 1 day after discharge (common practice default); checks: 72 h, weekly x4, then 4-weekly (common practice).
    expect(text).toContain('First home visit by the nurse: proposed for 9 Dec 2026.');
    expect(text).toContain('the first within 72 hours of discharge, then weekly for 4 weeks, then every 4 weeks');
    expect(text).toContain('Every step of the programme’s discharge checklist is done.');
    expect(text).toContain('Emergency: 999.');
    expect(text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });

  it('when a consultant overrode the checklist, then the letter says so with the reason and names the steps not done', async () => {
    const { infant, coord, consultant } = await approvedBaby(ctx.deps, ctx.app);
    await tickAll(coord, infant.id, ['smoke_alarms']);
    await post(consultant, `/api/infants/${infant.id}/discharge`, { date: '2026-12-05', overrideReason: 'Alarms fitted on the day by the fire service' }).expect(200);
    const { text } = await download(coord, infant.id);
    expect(text).toContain('before every step was done. Reason given: Alarms fitted on the day by the fire service');
    expect(text).toContain('Home safety: Working smoke alarms in the home');
  });

  it('when no date is set yet, then the letter says so and the first visit waits for the date', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    const { text } = await download(coord, infant.id);
    expect(text).toContain('Discharge date: not yet set.');
    expect(text).toContain('First home visit by the nurse: proposed once the discharge date is set.');
  });

  it('when the letter is e-mailed, then the attached PDF reads back as the same letter', async () => {
    const { infant, coord } = await approvedBaby(ctx.deps, ctx.app);
    const sent = await post(coord, `/api/infants/${infant.id}/discharge-letter/email`, { to: 'community.team@larkmoor.example' }).expect(200);
    expect(letterSentSchema.parse(sent.body)).toEqual({ sentTo: 'community.team@larkmoor.example', filename: expect.stringMatching(/^discharge-letter-.+\.pdf$/) });
    const message = ctx.mail.messages().find((m) => m.raw.includes('community.team@larkmoor.example'))!;
    const { text } = await readPdf(pdfAttachment(message)!);
    expect(text).toContain('Home oxygen discharge letter');
    expect(text).toContain(`${infant.givenName} ${infant.familyName}`);
  });
});
