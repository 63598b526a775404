import type { DefaultValues } from 'react-hook-form';
import type { z } from 'zod';
import type { enrolInfantSchemaFor } from '@shared/schemas/infant-contacts';

export type EnrolValues = z.input<ReturnType<typeof enrolInfantSchemaFor>>;
export type ContactValues = EnrolValues['contacts'][number];

export const ENROL_STEPS = [
  { title: 'Baby', fields: ['baby'] },
  { title: 'Hospital setting', fields: ['hospital'] },
  { title: 'Home', fields: ['home'] },
  { title: 'Care team and family', fields: ['care', 'contacts'] },
  { title: 'Check and save', fields: [] },
] as const satisfies readonly { title: string; fields: readonly (keyof EnrolValues)[] }[];

export const LAST_STEP = ENROL_STEPS.length - 1;

/** The step that holds a dotted field path such as `contacts.0.mobile`; null for fields no step shows. */
export function stepOfPath(path: string): number | null {
  const head = path.split('.')[0];
  const index = ENROL_STEPS.findIndex((step) => (step.fields as readonly string[]).includes(head));
  return index === -1 ? null : index;
}

export function emptyContact(timeZone: string): ContactValues {
  return {
    name: '',
    relation: '',
    mobile: '',
    email: '',
    preferredChannel: 'sms',
    consentSms: false,
    consentEmail: false,
    language: 'en',
    timeZone,
  };
}

/** Made once per form: the enrolKey lets a repeated submit return the same baby instead of a second one. */
export function enrolDefaults(timeZone: string, today: string): DefaultValues<EnrolValues> {
  return {
    enrolKey: crypto.randomUUID(),
    baby: {
      givenName: '',
      familyName: '',
      birthDate: '',
      gestation: {},
      weightDate: today,
      diagnoses: [],
    },
    hospital: {
      siteId: '',
      source: 'cylinder',
      o2Percent: 100,
    },
    home: {
      address: '',
      location: {},
      source: 'concentrator',
      o2Percent: 95,
    },
    care: { nurseId: '', consultantId: '' },
    contacts: [emptyContact(timeZone)],
  };
}
