import type { Role } from '@shared/auth/roles';

// Fictional programmes and people of the demo scenario (see the product brief). Demo only.
export const DEMO_PASSWORD = 'nestflow-demo';

export const DEMO_PROGRAMMES = [
  { slug: 'larkmoor', name: "Larkmoor Children's Home Oxygen Service", timeZone: 'Europe/London' },
  { slug: 'saltmarsh', name: 'Saltmarsh Neonatal Outreach', timeZone: 'Europe/London' },
] as const;

export interface DemoPerson {
  programme: (typeof DEMO_PROGRAMMES)[number]['slug'];
  role: Role;
  email: string;
  name: string;
}

export const DEMO_PEOPLE: DemoPerson[] = [
  { programme: 'larkmoor', role: 'admin', email: 'admin@larkmoor.example', name: 'Imogen Thistlewood' },
  { programme: 'larkmoor', role: 'coordinator', email: 'coordinator@larkmoor.example', name: 'Maren Oakes' },
  { programme: 'larkmoor', role: 'nurse', email: 'nurse@larkmoor.example', name: 'Tobias Fenwright' },
  { programme: 'larkmoor', role: 'nurse', email: 'nurse2@larkmoor.example', name: 'Ada Pennock' },
  { programme: 'larkmoor', role: 'consultant', email: 'consultant@larkmoor.example', name: 'Dr Helena Marchbank' },
  { programme: 'larkmoor', role: 'family', email: 'family@larkmoor.example', name: 'Rosa Quillfeather' },
  { programme: 'saltmarsh', role: 'admin', email: 'admin@saltmarsh.example', name: 'Callum Reedbank' },
  { programme: 'saltmarsh', role: 'coordinator', email: 'coordinator@saltmarsh.example', name: 'Nadia Shorewell' },
  { programme: 'saltmarsh', role: 'nurse', email: 'nurse@saltmarsh.example', name: 'Priya Dunmore' },
  { programme: 'saltmarsh', role: 'consultant', email: 'consultant@saltmarsh.example', name: 'Dr Owen Brackwater' },
  { programme: 'saltmarsh', role: 'family', email: 'family@saltmarsh.example', name: 'Jamie Tidemarsh' },
];
