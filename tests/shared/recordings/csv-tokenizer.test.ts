import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parse as csvParse } from 'csv-parse/sync';
import { createCsvTokenizer, type CsvProblem } from '@shared/recordings/csv-tokenizer';

function tokenize(chunks: string[]) {
  const records: Array<{ fields: string[]; line: number }> = [];
  const t = createCsvTokenizer((fields, line) => void records.push({ fields, line }));
  let problem: CsvProblem | null = null;
  for (const c of chunks) problem ??= t.push(c);
  problem ??= t.finish();
  return { records, problem };
}
const rows = (text: string) => tokenize([text]).records.map((r) => r.fields);

function cut(text: string, points: number[]): string[] {
  const at = [...new Set(points.map((p) => p % (text.length + 1)))].sort((a, b) => a - b);
  return [...at, text.length].map((p, i) => text.slice(i === 0 ? 0 : at[i - 1], p));
}

// Characters that exercise every state of the reader.
const csvish = fc.string({ unit: fc.constantFrom('a', '1', ',', '"', '\n', '\r', ' ', 'é', '\uFEFF'), maxLength: 80 });

describe('CSV reader: examples', () => {
  it('when fields are quoted, then commas, doubled quotes and line ends inside them are data', () => {
    expect(rows('a,b\n"x, y","say ""hi"""\n"two\nlines",z\n')).toEqual([['a', 'b'], ['x, y', 'say "hi"'], ['two\nlines', 'z']]);
  });

  it('when lines end in CRLF or CR, or the file starts with a byte-order mark, then the records are the same', () => {
    const expected = [['a', 'b'], ['1', '2']];
    expect(rows('a,b\r\n1,2\r\n')).toEqual(expected);
    expect(rows('a,b\r1,2')).toEqual(expected);
    expect(rows('\uFEFFa,b\n1,2\n')).toEqual(expected);
  });

  it('when blank lines appear, then they are skipped and line numbers still match the file', () => {
    const { records } = tokenize(['a,b\n\n1,"2\n2"\n\n3,4\n']);
    expect(records).toEqual([{ fields: ['a', 'b'], line: 1 }, { fields: ['1', '2\n2'], line: 3 }, { fields: ['3', '4'], line: 6 }]);
  });

  it.each([
    ['a,b\n1,2\n3\n', 3, /has 1 values but the header has 2/],
    ['a,b\n1,"2\n3,4\n', 2, /never closed/],
    ['a,b\n1,2"x\n', 2, /inside a value that does not start with one/],
    ['a,b\n"1"x,2\n', 2, /only a comma or a line end may follow a closing quote/],
    ['a,b\n"1\n1",2,3\n', 2, /has 3 values/],
    ['a,b\r\n"x\r\ny",1\r\n1,2,3\r\n', 4, /has 3 values/],
  ])('when the text is %j, then it is refused at line %i', (text, line, message) => {
    const { problem } = tokenize([text]);
    expect(problem?.line).toBe(line);
    expect(problem?.message).toMatch(message);
  });
});

describe('CSV reader: properties', () => {
  it('when given any string at all, then it returns records or a problem and never throws', () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ unit: 'binary', maxLength: 200 }), csvish), (text) => {
        const { problem } = tokenize([text]);
        if (problem) expect(problem.line).toBeGreaterThanOrEqual(1);
      }),
      { numRuns: 2000 },
    );
  });

  it('when the text is cut into chunks anywhere, then records, lines and problems are identical', () => {
    fc.assert(
      fc.property(csvish, fc.array(fc.nat(), { maxLength: 6 }), (text, points) => {
        expect(tokenize(cut(text, points))).toEqual(tokenize([text]));
      }),
      { numRuns: 2000 },
    );
  });

  // csv-parse is the reference: for well-formed tables both readers agree on the records, and for broken ones
  // on the refusal (one line-end style per file, as csv-parse settles on the first it meets).
  const table = fc.integer({ min: 1, max: 4 }).chain((width) =>
    fc.array(fc.array(fc.string({ unit: fc.constantFrom('a', '7', ',', '"', '\n', ' ', '.'), maxLength: 6 }), { minLength: width, maxLength: width }), { minLength: 1, maxLength: 8 }),
  );
  const needsQuotes = (f: string) => /[",\n\r]/.test(f) || f === '';
  const serialise = (records: string[][], eol: string, quoteAll: boolean) =>
    records.map((r) => r.map((f) => (quoteAll || needsQuotes(f) ? `"${f.replace(/"/g, '""')}"` : f)).join(',')).join(eol) + eol;

  it('when a generated table is written as CSV, then both readers give back exactly that table', () => {
    fc.assert(
      fc.property(table, fc.constantFrom('\n', '\r\n'), fc.boolean(), (records, eol, quoteAll) => {
        const text = serialise(records, eol, quoteAll);
        expect(rows(text)).toEqual(records);
        expect(csvParse(text, { bom: true, skip_empty_lines: true })).toEqual(records);
      }),
    );
  });

  it('when a table is damaged at random, then our reader refuses exactly when csv-parse does', () => {
    const damaged = fc.tuple(table, fc.nat(), fc.constantFrom('"', ',', 'x"', '"x', '\n"')).map(([records, at, junk]) => {
      const text = serialise(records, '\n', false);
      const p = at % (text.length + 1);
      return text.slice(0, p) + junk + text.slice(p);
    });
    fc.assert(
      fc.property(damaged, (text) => {
        let reference: string[][] | null = null;
        try {
          reference = csvParse(text, { bom: true, skip_empty_lines: true });
        } catch {
          reference = null;
        }
        const ours = tokenize([text]);
        expect(ours.problem === null).toBe(reference !== null);
        if (reference) expect(ours.records.map((r) => r.fields)).toEqual(reference);
      }),
      { numRuns: 1000 },
    );
  });
});

describe('CSV reader: line numbers inside quoted values', () => {
  // A refusal names the line of the file (DEVELOPERS.md "Limits and refusals"), so line ends inside quotes count:
  // LF, CR and CRLF each once (RFC 4180 line ends).
  const lines = (text: string) => tokenize([text]).records.map((r) => r.line);

  it('when the very first value opens with a line end inside quotes, then that line end is counted', () => {
    expect(lines('"\nx",b\nc,d\n')).toEqual([1, 3]);
  });

  it('when a quoted value holds a lone CR, or a CRLF, then each counts as one line end', () => {
    expect(lines('a,"1\r2"\nc,d\n')).toEqual([1, 3]);
    expect(lines('a,"1\r\n2"\nc,d\n')).toEqual([1, 3]);
    expect(lines('a,"1\r"\nc,d\n')).toEqual([1, 3]);
  });

  it('when a quoted value ends just after a CR and the next quoted value opens with LF, then both count', () => {
    expect(lines('"a\r","\nb"\nc,d\n')).toEqual([1, 4]);
  });

  it('when more text arrives after a refusal, then the same refusal is given and nothing more is read', () => {
    const records: string[][] = [];
    const t = createCsvTokenizer((fields) => void records.push(fields));
    const first = t.push('a,b\n1\n');
    expect(first).toEqual({ line: 2, message: 'Line 2 has 1 values but the header has 2.' });
    expect(t.push('3,4\n')).toBe(first);
    expect(t.finish()).toBe(first);
    expect(records).toEqual([['a', 'b']]);
  });

  it('when the last record ends with an empty value and no line end, then it is still read', () => {
    expect(rows('a,b\n1,')).toEqual([['a', 'b'], ['1', '']]);
  });
});


describe('CSV reader: other separators and a later first line', () => {
  const read = (text: string, options: Parameters<typeof createCsvTokenizer>[1]) => {
    const records: Array<[string[], number]> = [];
    const tokenizer = createCsvTokenizer((fields, line) => {
      records.push([fields, line]);
    }, options);
    const problem = tokenizer.push(text) ?? tokenizer.finish();
    return { records, problem };
  };

  it('when the separator is a semicolon or a tab, then commas stay inside values and lines count from the first line given', () => {
    expect(read('a;b\n"1;2";97,5\n', { separator: ';', firstLine: 5 }).records).toEqual([[['a', 'b'], 5], [['1;2', '97,5'], 6]]);
    expect(read('a\tb\n1,5\t2\n', { separator: '\t' }).records).toEqual([[['a', 'b'], 1], [['1,5', '2'], 2]]);
  });

  it('when text follows a closing quote, then the message names the separator in use and the file line', () => {
    expect(read('a;b\n"x"y;1\n', { separator: ';', firstLine: 3 }).problem).toEqual({ line: 4, message: 'Line 4: only a semicolon or a line end may follow a closing quote.' });
    expect(read('a\tb\n"x"y\t1\n', { separator: '\t' }).problem).toEqual({ line: 2, message: 'Line 2: only a tab or a line end may follow a closing quote.' });
    expect(read('a,b\n"x"y,1\n', {}).problem).toEqual({ line: 2, message: 'Line 2: only a comma or a line end may follow a closing quote.' });
  });

  it('when a row is short after skipped lines, then the file line is named', () => {
    expect(read('a;b\n1\n', { separator: ';', firstLine: 4 }).problem).toEqual({ line: 5, message: 'Line 5 has 1 values but the header has 2.' });
  });

  it('when a quoted value is never closed after skipped lines, then the line where it opened is named', () => {
    expect(read('a;b\n"1;2\n', { separator: ';', firstLine: 3 }).problem).toEqual({ line: 4, message: 'Line 4: a quoted value is never closed.' });
  });
});
