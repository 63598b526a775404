import { describe, expect, it } from 'vitest';
import { countFields, SAMPLE_LINES, SEPARATORS, sniffLayout } from '@shared/recordings/csv-layout';

const table = (separator: string, rows: number, decimal = '.') =>
  [`Date${separator}Time${separator}SpO2${separator}Pulse`, ...Array.from({ length: rows }, (_, i) => `24/11/2026${separator}21:00:${String(i % 60).padStart(2, '0')}${separator}97${decimal}5${separator}142${decimal}0`)].join('\n');

// Device exports as issue #13 describes them (common practice): comma, semicolon or tab between values, decimal
// commas with semicolons, a few lines of text before the column names.
describe('finding the layout of a device export', () => {
  it('when the separators are listed, then they are comma, semicolon and tab, and 40 lines decide', () => {
    expect(SEPARATORS).toEqual([',', ';', '\t']);
    expect(SAMPLE_LINES).toBe(40);
  });

  it('when fields are counted, then a separator inside quotes does not split', () => {
    expect(countFields('a,"b,c",d', ',')).toBe(3);
    expect(countFields('a;b;c', ',')).toBe(1);
    expect(countFields('', ';')).toBe(1);
    expect(countFields('a\tb', '\t')).toBe(2);
  });

  it('when our own comma file is given, then the layout is a comma with nothing skipped', () => {
    expect(sniffLayout('timestamp,spo2,pulse\n0,97,140\n1,97,140\n', true)).toEqual({ separator: ',', skipLines: 0, skipChars: 0 });
  });

  it('when values are separated by semicolons with decimal commas, then the semicolon wins over the commas inside values', () => {
    expect(sniffLayout(table(';', 50, ','), false)).toEqual({ separator: ';', skipLines: 0, skipChars: 0 });
  });

  it('when values are separated by tabs, then the tab is chosen', () => {
    expect(sniffLayout(table('\t', 5), true)).toEqual({ separator: '\t', skipLines: 0, skipChars: 0 });
  });

  it('when text lines come before the column names, then they are skipped, counted in lines and characters', () => {
    const preamble = 'Overnight oximetry export\r\nSerial: 00412\r\n\r\nStart: 24/11/2026 21:00\r\n';
    const text = preamble + table(';', 60, ',').replace(/\n/g, '\r\n');
    expect(sniffLayout(text, false)).toEqual({ separator: ';', skipLines: 4, skipChars: preamble.length });
  });

  it('when fewer than 40 lines have arrived and more may come, then it waits; at the end of the file it decides', () => {
    const text = table(';', 38);
    expect(sniffLayout(text, false)).toBeNull();
    expect(sniffLayout(`${text}\n`, false)).toBeNull();
    expect(sniffLayout(`${text}\n24/11/2026;21:01:00;97;140\n`, false)).toEqual({ separator: ';', skipLines: 0, skipChars: 0 });
    expect(sniffLayout(text, true)).toEqual({ separator: ';', skipLines: 0, skipChars: 0 });
  });

  it('when a data row is short, then the header is still the first line, so the reader reports the short row', () => {
    expect(sniffLayout('timestamp,spo2,pulse\n1,2\n3,4\n', true)).toEqual({ separator: ',', skipLines: 0, skipChars: 0 });
  });

  it('when two separators split lines equally often, then the one giving more fields wins, and a tie keeps the first listed', () => {
    expect(sniffLayout('a;b,c;d\n1;2,3;4\n', true)).toMatchObject({ separator: ';' });
    expect(sniffLayout('a;b,c\n1;2,3\n', true)).toMatchObject({ separator: ',' });
  });

  it('when no separator splits the lines, then a comma and no skip, so the column check explains', () => {
    expect(sniffLayout('just text\nmore text\n', true)).toEqual({ separator: ',', skipLines: 0, skipChars: 0 });
    expect(sniffLayout('', true)).toEqual({ separator: ',', skipLines: 0, skipChars: 0 });
  });

  it('when blank lines sit among the text lines, then they do not count towards a width', () => {
    expect(sniffLayout('\n\nhead\n\na,b\n1,2\n3,4\n', true)).toEqual({ separator: ',', skipLines: 4, skipChars: 8 });
  });
});
