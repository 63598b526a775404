import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { convertPrescription } from '@shared/clinical/conversion';
import {
  conversionPreviewBodySchema,
  conversionPreviewResponseSchema,
  pressureSourceSchema,
} from '@shared/schemas/conversions';

const valid = {
  weightKg: 3,
  flowLpm: 0.25,
  sourceO2Percent: 100,
  hospital: { elevationM: 0 },
  home: { elevationFt: 6000 },
};

function messagesFor(body: unknown): Record<string, string[]> {
  const result = conversionPreviewBodySchema.safeParse(body);
  if (result.success) return {};
  const byPath: Record<string, string[]> = {};
  for (const issue of result.error.issues) (byPath[issue.path.join('.')] ??= []).push(issue.message);
  return byPath;
}

describe('conversion preview body schema', () => {
  it('when the body is complete and in range, then it parses to the clinical input shape', () => {
    const parsed = conversionPreviewBodySchema.parse({ ...valid, flowmeterStepsLpm: [0.1, 0.2, 0.5] });
    expect(parsed.home).toEqual({ elevationFt: 6000 });
    expect(() => convertPrescription(parsed)).not.toThrow();
  });

  it('when values are out of range, then each field gets its own plain message', () => {
    expect(messagesFor({ ...valid, weightKg: 0 })).toEqual({ weightKg: ['Weight must be above 0 kg'] });
    expect(messagesFor({ ...valid, weightKg: 15.1 })).toEqual({ weightKg: ['Weight must be at most 15 kg'] });
    expect(messagesFor({ ...valid, flowLpm: -0.1 })).toEqual({ flowLpm: ['Flow cannot be negative'] });
    expect(messagesFor({ ...valid, flowLpm: 16 })).toEqual({ flowLpm: ['Flow must be at most 15 L/min'] });
    expect(messagesFor({ ...valid, sourceO2Percent: 20 })).toEqual({
      sourceO2Percent: ['Source oxygen must be at least 21 %'],
    });
    expect(messagesFor({ ...valid, sourceO2Percent: 101 })).toEqual({
      sourceO2Percent: ['Source oxygen must be at most 100 %'],
    });
    expect(messagesFor({ ...valid, weightKg: '3' })).toEqual({ weightKg: ['Weight must be a number of kg'] });
    expect(messagesFor({ ...valid, homeSourceO2Percent: 95 })).toEqual({});
    expect(messagesFor({ ...valid, homeSourceO2Percent: 15 })).toEqual({
      homeSourceO2Percent: ['Source oxygen must be at least 21 %'],
    });
  });

  it('when an elevation or pressure is out of range, then the message names the limit and the unit', () => {
    expect(messagesFor({ ...valid, home: { elevationM: 6001 } })).toEqual({
      'home.elevationM': ['Elevation must be at most 6000 m'],
    });
    expect(messagesFor({ ...valid, home: { elevationM: -501 } })).toEqual({
      'home.elevationM': ['Elevation must be at least -500 m'],
    });
    // 6000 m = 19685.04 ft and −500 m = −1640.42 ft (1 ft = 0.3048 m)
    expect(messagesFor({ ...valid, home: { elevationFt: 19685 } })).toEqual({});
    expect(messagesFor({ ...valid, home: { elevationFt: 19686 } })).toEqual({
      'home.elevationFt': ['Elevation must be at most 19685 ft (6000 m)'],
    });
    expect(messagesFor({ ...valid, home: { elevationFt: -1641 } })).toEqual({
      'home.elevationFt': ['Elevation must be at least -1640 ft (-500 m)'],
    });
    expect(messagesFor({ ...valid, hospital: { pressureMmHg: 299 } })).toEqual({
      'hospital.pressureMmHg': ['Pressure must be at least 300 mmHg'],
    });
    expect(messagesFor({ ...valid, hospital: { pressureMmHg: 801 } })).toEqual({
      'hospital.pressureMmHg': ['Pressure must be at most 800 mmHg'],
    });
  });

  it('when a place has none or more than one of the three keys, then one clear message says so', () => {
    const oneOf = ['Give one of: elevation in metres, elevation in feet, or a measured pressure in mmHg'];
    expect(messagesFor({ ...valid, home: {} })).toEqual({ home: oneOf });
    expect(messagesFor({ ...valid, home: { elevationM: 100, elevationFt: 328 } })).toEqual({ home: oneOf });
    expect(messagesFor({ ...valid, hospital: { elevationM: 0, pressureMmHg: 760 } })).toEqual({ hospital: oneOf });
    expect(messagesFor({ ...valid, home: null })).toEqual({ home: oneOf });
    expect(pressureSourceSchema.safeParse({ pressureMmHg: 700 }).success).toBe(true);
  });

  it('when unknown keys are sent, then they are rejected at the top level and inside a place', () => {
    expect(messagesFor({ ...valid, pressureModel: 'west-1996' })).toEqual({ '': ['Unknown field: pressureModel'] });
    const unknownInPlace = { ...valid, home: { elevationM: 100, altitude: 3 } };
    expect(messagesFor(unknownInPlace)).toEqual({ home: ['Unknown field: altitude'] });
  });

  it('when flowmeter steps are not positive, not ascending, or too many, then they are rejected', () => {
    expect(messagesFor({ ...valid, flowmeterStepsLpm: [0, 0.5] })).toEqual({
      'flowmeterStepsLpm.0': ['Flowmeter steps must be above 0 L/min'],
    });
    expect(messagesFor({ ...valid, flowmeterStepsLpm: [0.5, 0.25] })).toEqual({
      flowmeterStepsLpm: ['Flowmeter steps must be in ascending order without repeats'],
    });
    expect(messagesFor({ ...valid, flowmeterStepsLpm: [0.5, 0.5] })).toHaveProperty('flowmeterStepsLpm');
    const steps200 = Array.from({ length: 200 }, (_, i) => (i + 1) / 100);
    expect(messagesFor({ ...valid, flowmeterStepsLpm: steps200 })).toEqual({});
    expect(messagesFor({ ...valid, flowmeterStepsLpm: [...steps200, 2.01] })).toEqual({
      flowmeterStepsLpm: ['At most 200 flowmeter steps'],
    });
    expect(messagesFor({ ...valid, flowmeterStepsLpm: [] })).toEqual({
      flowmeterStepsLpm: ['Give at least one flowmeter step'],
    });
  });
});

describe('conversion preview response schema', () => {
  it('when any accepted body is converted, then the result matches the response schema', () => {
    const place = fc.oneof(
      fc.record({ elevationM: fc.double({ min: -500, max: 6000, noNaN: true }) }),
      fc.record({ elevationFt: fc.double({ min: -1640, max: 19685, noNaN: true }) }),
      fc.record({ pressureMmHg: fc.double({ min: 300, max: 800, noNaN: true }) }),
    );
    fc.assert(
      fc.property(
        fc.record({
          weightKg: fc.double({ min: 0.01, max: 15, noNaN: true }),
          flowLpm: fc.double({ min: 0, max: 15, noNaN: true }),
          sourceO2Percent: fc.double({ min: 21, max: 100, noNaN: true }),
          hospital: place,
          home: place,
        }),
        (body) => {
          const parsed = conversionPreviewBodySchema.parse(body);
          const response = conversionPreviewResponseSchema.safeParse(convertPrescription(parsed));
          expect(response.success).toBe(true);
        },
      ),
    );
  });

  it('when a response carries an unknown warning code, then it is rejected', () => {
    const result = convertPrescription(conversionPreviewBodySchema.parse(valid));
    const tampered = { ...result, warnings: [{ code: 'SOMETHING_ELSE', message: 'x' }] };
    expect(conversionPreviewResponseSchema.safeParse(tampered).success).toBe(false);
  });
});
