import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { convertPrescription } from '@shared/clinical/conversion';
import type { WorkingLine } from '@shared/clinical/working';
import { Cautions } from '../../web/components/clinical/cautions';
import { WorkingTable } from '../../web/components/clinical/working-table';

const lines: WorkingLine[] = [
  { key: 'home.pb', label: 'Air pressure at home', value: 614.234, unit: 'mmHg', formula: 'PB = 101325 × (…)^5.2559', source: 'ISA 1976' },
  { key: 'hospital.fio2', label: 'Effective FiO2 in hospital', value: 0.34857, unit: 'fraction', formula: '0.21 + f × (Fs − 0.21)', source: 'STOP-ROP' },
  { key: 'home.flow', label: 'Flow needed', value: 0.1166666, unit: 'L/min', formula: 'f × W', source: 'inverse' },
  { key: 'home.elev', label: 'Home elevation', value: 1780, unit: 'm', formula: 'as entered', source: 'form' },
  { key: 'none', label: 'Not reachable', value: null, unit: 'L/min', formula: '—', source: '—' },
];

describe('WorkingTable', () => {
  it('when given working lines, then each is a row with its value in the unit and the formula and source as cells', () => {
    render(<WorkingTable working={lines} />);
    const rows = within(screen.getByRole('table')).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(lines.length);
    const cells = (i: number) => within(rows[i]).getAllByRole('cell').map((cell) => cell.textContent);
    expect(within(rows[0]).getByRole('rowheader')).toHaveTextContent('Air pressure at home');
    expect(cells(0)).toEqual(['614.2 mmHg', 'PB = 101325 × (…)^5.2559', 'ISA 1976']);
    expect(cells(1)[0]).toBe('0.3486 (34.9 %)');
    expect(cells(2)[0]).toBe('0.117 L/min');
    expect(cells(3)[0]).toBe('1780 m');
    expect(cells(4)[0]).toBe('—');
  });

  it('when there are warnings and a model, then warnings are listed above with a word prefix and models below', () => {
    const result = convertPrescription({
      weightKg: 2.4, flowLpm: 0.5, sourceO2Percent: 100, homeSourceO2Percent: 95, hospital: { elevationM: 95 }, home: { elevationM: 1780 },
    });
    render(<WorkingTable working={result.working} warnings={result.warnings} model={result.model} />);
    const list = screen.getByRole('list', { name: 'Points to check' });
    const items = within(list).getAllByRole('listitem');
    expect(items).toHaveLength(result.warnings.length);
    for (const item of items) expect(item.textContent).toMatch(/^Check: /);
    expect(list.compareDocumentPosition(screen.getByRole('table')) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    const models = screen.getByLabelText('Models used');
    expect(models).toHaveTextContent(result.model.pressure.name);
    expect(models).toHaveTextContent(result.model.cannula.name);
    expect(models).toHaveTextContent(result.model.version);
    expect(list.compareDocumentPosition(models) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
    expect(within(screen.getByRole('table')).getAllByRole('row')).toHaveLength(result.working.length + 1);
  });
});

describe('Cautions', () => {
  it('when shown to staff or family, then both carry the clinician, fire-safety and emergency points', () => {
    const { unmount } = render(<Cautions variant="staff" />);
    const staff = screen.getByRole('complementary', { name: 'Cautions' });
    expect(staff).toHaveTextContent(/not a prescription/);
    expect(staff).toHaveTextContent(/licensed clinician/);
    expect(staff).toHaveTextContent(/no smoking/i);
    expect(staff).toHaveTextContent(/emergency number/);
    unmount();
    render(<Cautions variant="family" />);
    const family = screen.getByRole('complementary', { name: 'Keep your baby safe' });
    expect(family).toHaveTextContent(/no smoking/i);
    expect(family).toHaveTextContent(/emergency number/);
    expect(family.className).toContain('text-lg');
  });
});
