// Fictional babies of the demo scenario: invented names, towns from the product brief, figures chosen to look
// like a real caseload. Demo only; nothing here is a clinical reference.
export const DEMO_SITES = {
  larkmoor: { name: "Larkmoor Regional Children's Hospital", elevationM: 95 },
  saltmarsh: { name: 'Saltmarsh District Hospital', elevationM: 5 },
} as const;

export const TOWNS = [
  { name: 'Emberly', elevationM: 40 },
  { name: 'Wrenbrook', elevationM: 610 },
  { name: 'Tallow Ridge', elevationM: 1240 },
  { name: 'Cindermoor', elevationM: 1780 },
  { name: 'High Saddle', elevationM: 2350 },
] as const;

const GIVEN = ['Ada', 'Milo', 'Isla', 'Rowan', 'Ivy', 'Ezra', 'Wren', 'Otto', 'Nell', 'Arlo', 'Maeve', 'Jude', 'Elsie', 'Finn',
  'Thea', 'Caspian', 'Lark', 'Bram', 'Posy', 'Emrys'];
const FAMILY = ['Ashcombe', 'Brindlewood', 'Calloway', 'Dunmere', 'Everleigh', 'Fairholt', 'Greaves', 'Hartwell', 'Inchley',
  'Jessop', 'Kettering', 'Lowther', 'Marchetti', 'Nightingale', 'Okafor', 'Penhallow', 'Quenby', 'Rasmussen', 'Stroud', 'Thackeray'];

export type DemoOutcome = 'awaiting' | 'sent_back' | 'active' | 'drift' | 'stepping_down' | 'off_oxygen' | 'left';

export interface DemoBaby {
  key: string;
  givenName: string;
  familyName: string;
  sex: 'female' | 'male';
  gaWeeks: number;
  gaDays: number;
  ageDays: number;
  birthWeightG: number;
  weightKg: number;
  town: (typeof TOWNS)[number];
  hospitalFlowLpm: number;
  hospitalSource: 'cylinder' | 'blended';
  hospitalO2Percent: number;
  homeSource: 'concentrator' | 'cylinder';
  nurse: 'nurse@larkmoor.example' | 'nurse2@larkmoor.example';
  diagnoses: string[];
  outcome: DemoOutcome;
}

const OUTCOMES: DemoOutcome[] = [
  ...Array<DemoOutcome>(8).fill('awaiting'), 'sent_back', 'sent_back', ...Array<DemoOutcome>(18).fill('active'),
  'drift', 'drift', 'drift', ...Array<DemoOutcome>(4).fill('stepping_down'), ...Array<DemoOutcome>(3).fill('off_oxygen'), 'left', 'left',
];
export const SALTMARSH_FAMILIES = ['Tidewell', 'Eastmarsh', 'Brackley', 'Shoreham', 'Mudford', 'Reedley', 'Gullane', 'Samphire',
  'Curlew', 'Dunlin', 'Sandling', 'Oystercatch'];
const FLOWS = [0.05, 0.1, 0.125, 0.2, 0.25, 0.3, 0.5];

/** A deterministic list, so a second seed run finds the same babies by their enrol keys. */
export function demoBabies(): DemoBaby[] {
  return OUTCOMES.map((outcome, i) => {
    const gaWeeks = 24 + ((i * 7) % 11);
    const ageDays = 40 + ((i * 37) % 120);
    const birthWeightG = 560 + gaWeeks * 30 + ((i * 53) % 400);
    // Roughly 25 g a day of catch-up growth from birth weight, kept in a plausible band.
    const weightKg = Math.round(Math.min(7.5, birthWeightG / 1000 + ageDays * 0.025) * 100) / 100;
    const blended = i % 9 === 4;
    return {
      key: `00000000-0000-4000-8000-${String(i + 1).padStart(12, '0')}`,
      givenName: GIVEN[i % GIVEN.length],
      familyName: FAMILY[(i * 3 + Math.floor(i / FAMILY.length)) % FAMILY.length],
      sex: i % 2 ? 'male' : 'female',
      gaWeeks,
      gaDays: (i * 3) % 7,
      ageDays,
      birthWeightG,
      weightKg,
      town: TOWNS[i % TOWNS.length],
      hospitalFlowLpm: blended ? 1 : FLOWS[i % FLOWS.length],
      hospitalSource: blended ? 'blended' : 'cylinder',
      hospitalO2Percent: blended ? 40 : 100,
      homeSource: i % 6 === 5 ? 'cylinder' : 'concentrator',
      nurse: i % 3 === 0 ? 'nurse2@larkmoor.example' : 'nurse@larkmoor.example',
      diagnoses: ['chronic_lung_disease', ...(i % 7 === 3 ? ['pulmonary_hypertension'] : []), ...(i % 11 === 6 ? ['heart_disease'] : [])],
      outcome,
    };
  });
}
