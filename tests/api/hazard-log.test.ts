import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { findTest, hazardIds, testReferences } from '../helpers/hazard-log';

// HAZARDS.md names, for every control, the tests that verify it. This reads those references and finds each test in
// its file, so a control whose test is renamed, removed or skipped fails here instead of silently losing its check.
// It reads files across tests/, so it lives with the server tests, not in the shared-only project.
const ROOT = join(__dirname, '..', '..');
const LOG = readFileSync(join(ROOT, 'HAZARDS.md'), 'utf8');

describe('the hazard log’s test references', () => {
  it('when the log is read, then every hazard in the table has at least one named test, and every reference belongs to a hazard in the table', () => {
    const ids = hazardIds(LOG);
    const refs = testReferences(LOG);
    // The reader itself must find the log's contents: a broken pattern would otherwise pass with nothing to check.
    expect(ids.length).toBeGreaterThanOrEqual(22);
    expect(refs.length).toBeGreaterThan(ids.length);
    for (const id of ids) expect(refs.filter((r) => r.hazard === id).length, `${id} names no test`).toBeGreaterThan(0);
    for (const ref of refs) expect(ids, `HAZARDS.md line ${ref.line} is under an unknown hazard`).toContain(ref.hazard);
  });

  it('when each named test is looked up, then its file exists and holds a test of exactly that title that is not skipped', () => {
    const problems: string[] = [];
    for (const ref of testReferences(LOG)) {
      const path = join(ROOT, ref.file);
      if (!ref.file.startsWith('tests/') || !existsSync(path)) {
        problems.push(`${ref.hazard} (line ${ref.line}): no file ${ref.file}`);
        continue;
      }
      const found = findTest(readFileSync(path, 'utf8'), ref.title, ref.file);
      if (found !== 'ok') problems.push(`${ref.hazard} (line ${ref.line}): "${ref.title}" is ${found} in ${ref.file}`);
    }
    expect(problems).toEqual([]);
  });
});

describe('finding a named test in a file', () => {
  const file = [
    "describe('rounding', () => {",
    "  it('when a flow is between steps, then it goes up', () => {});",
    "  it.skip('when skipped with .skip', () => {});",
    "  xit('when skipped with xit', () => {});",
    "  it.todo('when only planned');",
    "  it('when written without a body');",
    "  test.skipIf(process.env.CI)('when skipped on some runs', () => {});",
    "  it.each([1, 2])('when %i is given, then it is used', () => {});",
    '  it(`when ${COUNT} reminders fall due`, () => {});',
    '});',
    "describe.skip('a skipped group', () => {",
    "  it('when inside a skipped describe', () => {});",
    '});',
    "xdescribe('another skipped group', () => { describe('inner', () => { it('when two levels down', () => {}); }); });",
  ].join('\n');

  it('when the title is there and runs, then it is found, as a describe, an it, an it.each with %i or a template with ${…}', () => {
    for (const title of ['rounding', 'when a flow is between steps, then it goes up', 'when %i is given, then it is used', 'when ${COUNT} reminders fall due']) {
      expect(findTest(file, title), title).toBe('ok');
    }
  });

  it('when the test is skipped in any form, then it is reported skipped, not found', () => {
    for (const title of ['when skipped with .skip', 'when skipped with xit', 'when only planned', 'when written without a body', 'when skipped on some runs',
      'when inside a skipped describe', 'a skipped group', 'when two levels down']) {
      expect(findTest(file, title), title).toBe('skipped');
    }
  });

  it('when the title differs by a word, a letter or its case, or only appears in a comment or a string, then it is missing', () => {
    const withMentions = `${file}\n// it('when mentioned in a comment', () => {});\nconst s = "it('when inside a string', () => {})";`;
    for (const title of ['when a flow is between steps, then it goes down', 'When a flow is between steps, then it goes up', 'rounding ',
      'when mentioned in a comment', 'when inside a string']) {
      expect(findTest(withMentions, title), title).toBe('missing');
    }
  });

  it('when HAZARDS.md lines are read, then only `file` › "title" lines under a hazard heading are references', () => {
    const md = ['| H1 | a | b | c | d |', '### H1 Something', '- `tests/a.test.ts` › "when “quoted” words, then fine"', 'a line of prose',
      '## Other', '- `tests/b.test.ts` › "not under a hazard"'].join('\n');
    expect(hazardIds(md)).toEqual(['H1']);
    expect(testReferences(md)).toEqual([{ hazard: 'H1', file: 'tests/a.test.ts', title: 'when “quoted” words, then fine', line: 3 }]);
  });
});
