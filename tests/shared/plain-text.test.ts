import { describe, expect, it } from 'vitest';
import { plainText } from '@shared/schemas/common';
import { createUserSchema, listUsersQuerySchema } from '@shared/schemas/users';
import { createReadingSchema } from '@shared/schemas/readings';
import { bookVisitSchema } from '@shared/schemas/visits';
import { signInSchema } from '@shared/schemas/session';

describe('plainText: the one text contract', () => {
  const line = plainText();
  const block = plainText({ multiline: true });

  it.each(['\u0000', '\u0007', '\u001b[31m', '\u007f', '\u0085', '\u009b', 'tab\there', 'line\nbreak', '\ud800'])(
    'when single-line text holds %j, then it is refused', (bad) => {
      expect(line.safeParse(`a${bad}b`).success).toBe(false);
    },
  );

  it('when multi-line text holds tab, line feed or CR LF, then it is kept; NUL and escape are still refused', () => {
    expect(block.parse('first\tline\r\nsecond\n')).toBe('first\tline\r\nsecond\n');
    expect(block.safeParse('a\u0000b').success).toBe(false);
    expect(block.safeParse('a\u001bb').success).toBe(false);
  });

  it('when text is ordinary (accents, other scripts, emoji), then it passes unchanged', () => {
    for (const ok of ['Zoë Ó Briain', 'Łucja', '山田 花子', 'Dr Varga 👶', '']) expect(line.parse(ok)).toBe(ok);
  });

  it('when the shared contracts get a NUL in a text field or search, then that field is named', () => {
    const user = createUserSchema.safeParse({ email: 'a@b.example', name: 'Ad\u0000a', role: 'nurse' });
    expect(user.error?.issues.map((i) => i.path.join('.'))).toEqual(['name']);
    expect(listUsersQuerySchema.safeParse({ q: '\u0000' }).success).toBe(false);
    expect(signInSchema.safeParse({ email: 'a@b.example', password: 'pass\u0000word' }).success).toBe(false);
    const reading = createReadingSchema.safeParse({ takenAt: '2026-12-01T10:00:00Z', spo2: 95, state: 'awake', notes: 'fine\u0000' });
    expect(reading.error?.issues.map((i) => i.path.join('.'))).toEqual(['notes']);
    expect(createReadingSchema.safeParse({ takenAt: '2026-12-01T10:00:00Z', spo2: 95, state: 'awake', notes: 'fed\nsettled' }).success).toBe(true);
    const visit = bookVisitSchema.safeParse({ kind: 'home_visit', date: '2026-12-03', time: '10:00', durationMinutes: 30, staffId: '5b1c0a55-0000-4000-8000-00000000c0de', purpose: 'Check\u0000' });
    expect(visit.error?.issues.map((i) => i.path.join('.'))).toEqual(['purpose']);
  });
});
