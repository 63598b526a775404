import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { AUDIT_ACTIONS } from '@shared/audit/audit-actions';

// A standing check over the server's own source: every audit action it writes has words (shared/audit). It reads
// server/, worker/ and seed/, so it lives with the server tests, not in the pure shared project (which mutation
// testing runs in a copy holding only shared code).
const ROOT = join(__dirname, '..', '..');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? sourceFiles(path) : name.endsWith('.ts') ? [path] : [];
  });
}

/**
 * A template literal cannot be read statically: each one the code writes is listed here with every value it can
 * take. A new template fails the test below until it is added, with its words.
 */
const TEMPLATES: Record<string, string[]> = {
  "`prescription.${input.decision === 'approve' ? 'approved' : 'rejected'}`": ['prescription.approved', 'prescription.rejected'],
  '`prescription.${p.reason}_proposed`': ['prescription.step_down_proposed', 'prescription.step_up_proposed', 'prescription.leave_programme_proposed'],
  '`journey.${j.status}`': ['journey.approved', 'journey.declined'],
};

/** Every `action:` written next to an audit entry (a change, or a read through `auditRead`) in server/, worker/ and seed/: its string literals, and its templates. */
function actionsInSource() {
  const literals = new Set<string>();
  const templates = new Set<string>();
  for (const file of ['server', 'worker', 'seed'].flatMap((dir) => sourceFiles(join(ROOT, dir)))) {
    const text = readFileSync(file, 'utf8');
    if (!text.includes('audit.append(') && !text.includes('auditRead(')) continue;
    for (const match of text.matchAll(/\baction:\s*([^,\n]+(?:\?[^,\n]+)?)/g)) {
      const expression = match[1].trim();
      if (expression.startsWith('`')) templates.add(expression.slice(0, expression.lastIndexOf('`') + 1));
      for (const literal of expression.matchAll(/'([a-z_]+[.][a-z_.-]+)'/g)) literals.add(literal[1]);
    }
  }
  return { literals, templates };
}

describe('audit actions written by the server', () => {
  it('when the server writes an audit action, then it is in the list of known actions (so it has words)', () => {
    const { literals, templates } = actionsInSource();
    // The scan itself must find the actions: a broken pattern would otherwise pass with nothing to check.
    expect(literals.size).toBeGreaterThan(30);
    for (const action of literals) expect(AUDIT_ACTIONS, `"${action}" needs an entry in shared/audit`).toContain(action);
    for (const template of templates) {
      expect(Object.keys(TEMPLATES), `the template ${template} needs its values listed in this test`).toContain(template);
      for (const action of TEMPLATES[template]) expect(AUDIT_ACTIONS).toContain(action);
    }
  });

});
