import { describe, expect, it } from 'vitest';
import { LOINC, LOINC_SYSTEM, UCUM, UCUM_SYSTEM } from '@shared/fhir/codes';

/**
 * LOINC's "Mod 10" check digit (LOINC Users' Guide, "Calculating Mod10 check digits"): counting from the right, the
 * digits in odd places are doubled and the digits of the products added, the even places added as they are; the check
 * digit brings the total up to the next multiple of 10.
 */
function loincCheckDigit(body: string): number {
  const sum = [...body].reverse().reduce((total, ch, i) => {
    const d = Number(ch);
    if (i % 2 === 1) return total + d;
    const doubled = d * 2;
    return total + Math.floor(doubled / 10) + (doubled % 10);
  }, 0);
  return (10 - (sum % 10)) % 10;
}

describe('LOINC codes of the FHIR export', () => {
  it('when the check digit is worked out for the Users’ Guide example 12345, then it is 5 (LOINC Users’ Guide, Mod10 example)', () => {
    expect(loincCheckDigit('12345')).toBe(5);
  });

  it('when each code is split at its dash, then the last digit is the Mod 10 check digit of the rest', () => {
    for (const { code } of Object.values(LOINC)) {
      const [body, check] = code.split('-');
      expect(loincCheckDigit(body), code).toBe(Number(check));
    }
  });

  it('when the codes and display names are compared with the LOINC table, then each matches its entry', () => {
    // LOINC table, version 2.81 (as expanded in HL7's vital-sign oxygen saturation value set): 59408-5.
    expect(LOINC.spo2PulseOximetry).toEqual({ code: '59408-5', display: 'Oxygen saturation in Arterial blood by Pulse oximetry' });
    // LOINC table, version 2.81: code as HL7's FHIR R4 heart rate profile fixes it; display from memory.
    expect(LOINC.heartRate).toEqual({ code: '8867-4', display: 'Heart rate' });
    // LOINC table, version 2.81: code as HL7's FHIR R4 body weight profile fixes it; display from memory.
    expect(LOINC.bodyWeight).toEqual({ code: '29463-7', display: 'Body weight' });
    // LOINC table, version 2.81: code and display as HL7's US Core pulse oximetry example gives them.
    expect(LOINC.inhaledO2FlowRate).toEqual({ code: '3151-8', display: 'Inhaled oxygen flow rate' });
    // LOINC table, version 2.81: code named by HL7's US Core pulse oximetry profile; display from memory.
    expect(LOINC.inhaledO2Concentration).toEqual({ code: '3150-0', display: 'Inhaled oxygen concentration' });
    expect(LOINC_SYSTEM).toBe('http://loinc.org');
  });

  it('when the units are compared with UCUM, then they are its case-sensitive codes (UCUM specification: %, /min, kg, L/min)', () => {
    expect(UCUM_SYSTEM).toBe('http://unitsofmeasure.org');
    expect([UCUM.percent, UCUM.perMinute, UCUM.kilogram, UCUM.litrePerMinute]).toEqual(['%', '/min', 'kg', 'L/min']);
  });
});
