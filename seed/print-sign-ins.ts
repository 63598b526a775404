import { ROLE_LABELS } from '@shared/auth/roles';
import { DEMO_PASSWORD, DEMO_PEOPLE } from './demo-people';

console.log(`  Demo sign-ins (demo data only), password for all: ${DEMO_PASSWORD}`);
for (const p of DEMO_PEOPLE) console.log(`    ${p.email.padEnd(32)} ${ROLE_LABELS[p.role]}`);
