import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  alveolarArterialGradientMmHg,
  alveolarPo2FullMmHg,
  alveolarPo2SimplifiedMmHg,
  equivalentFio2,
  inspiredPo2MmHg,
} from '@shared/clinical/oxygen';
import { isaPressureMmHg, isaPressurePaAtGeopotentialM, resolvePressure } from '@shared/clinical/pressure';
import { paToMmHg } from '@shared/clinical/units';

describe('inspired PO2', () => {
  it('when breathing air (0.2093) at sea level, then PIO2 is 149.2 mmHg', () => {
    // docs/clinical-sources.md §2.2 and §10 #9: (760 − 47) × 0.2093 = 149.2 mmHg [C physiology notes]; 149.23 computed
    expect(inspiredPo2MmHg(0.2093, 760)).toBeCloseTo(149.23, 2);
  });

  it('when breathing 0.21 at sea level, then PIO2 is 149.7 mmHg (the ADC table prints 150)', () => {
    // §2.2: 149.7 computed from FiO2 × (PB − 47); Arch Dis Child Table 1 prints 150 [C b]
    expect(inspiredPo2MmHg(0.21, 760)).toBeCloseTo(149.73, 2);
    expect(Math.round(inspiredPo2MmHg(0.21, 760))).toBe(150);
  });

  it('when at 1000/2000/3000/5000/8000 m, then PIO2 is within 1 mmHg of the ADC table', () => {
    // §2.2: ADC Table 1 132/115/100/75/46 mmHg [C b] (the table's own rounding and 47.1 mmHg vapour differ slightly)
    const adc: [number, number][] = [
      [1000, 132],
      [2000, 115],
      [3000, 100],
      [5000, 75],
      [8000, 46],
    ];
    for (const [elevationM, pio2] of adc) {
      expect(Math.abs(inspiredPo2MmHg(0.21, isaPressureMmHg(elevationM)) - pio2)).toBeLessThanOrEqual(1);
    }
  });

  it('when at 1000/2000/3000/5000 m geopotential, then PIO2 is 131.7/115.3/100.6/75.2 mmHg', () => {
    // §2.2 computed values [X] (FiO2 0.21, PH2O 47, ISA geopotential pressures)
    const computed: [number, number][] = [
      [1000, 131.7],
      [2000, 115.3],
      [3000, 100.6],
      [5000, 75.2],
    ];
    for (const [heightM, pio2] of computed) {
      const pressureMmHg = paToMmHg(isaPressurePaAtGeopotentialM(heightM));
      expect(inspiredPo2MmHg(0.21, pressureMmHg)).toBeCloseTo(pio2, 1);
    }
  });

  it('when on the Everest summit (250 mmHg), then PIO2 is about 43 mmHg', () => {
    // §2.2: (250 − 47) × 0.2093 ≈ 43 mmHg [C applied biofluid mechanics textbook]; computed 42.49
    expect(inspiredPo2MmHg(0.2093, 250)).toBeCloseTo(42.49, 2);
    expect(Math.abs(inspiredPo2MmHg(0.2093, 250) - 43)).toBeLessThan(1);
  });

  it('when the pressure does not exceed water vapour, then it is refused', () => {
    expect(() => inspiredPo2MmHg(0.21, 47)).toThrow(RangeError);
  });
});

describe('alveolar gas equation', () => {
  it('when air at 760 mmHg with PaCO2 40, then simplified 99.7 and full 101.8 mmHg', () => {
    // §2.2 computed values [X]
    const input = { fio2: 0.21, pressureMmHg: 760, paco2MmHg: 40 };
    expect(alveolarPo2SimplifiedMmHg(input)).toBeCloseTo(99.7, 1);
    expect(alveolarPo2FullMmHg(input)).toBeCloseTo(101.8, 1);
  });

  it('when air at 760 mmHg with PaCO2 36, then the full form gives the published 107 mmHg', () => {
    // §2.2 and §10 #11: alveolar-gas-equation sample-values table gives 107 mmHg [C]; computed 106.6. The misprinted
    // bracket (1 − FiO2/R) would give 115.6, so this check guards against it.
    const full = alveolarPo2FullMmHg({ fio2: 0.21, pressureMmHg: 760, paco2MmHg: 36, respiratoryExchangeRatio: 0.8 });
    expect(full).toBeCloseTo(106.6, 1);
    expect(Math.round(full)).toBe(107);
  });

  it('when breathing 100% oxygen at 760 mmHg with PaCO2 40, then simplified 663.0 and full 673.0 mmHg', () => {
    // §2.2 computed values [X]
    const input = { fio2: 1, pressureMmHg: 760, paco2MmHg: 40 };
    expect(alveolarPo2SimplifiedMmHg(input)).toBeCloseTo(663.0, 6);
    expect(alveolarPo2FullMmHg(input)).toBeCloseTo(673.0, 6);
  });

  it('when in an 8000 ft cabin (564.5 mmHg) on air, then simplified 58.7 and full 60.8 mmHg', () => {
    // §2.2 computed values [X]
    const input = { fio2: 0.21, pressureMmHg: 564.5, paco2MmHg: 40 };
    expect(alveolarPo2SimplifiedMmHg(input)).toBeCloseTo(58.7, 1);
    expect(alveolarPo2FullMmHg(input)).toBeCloseTo(60.8, 1);
  });

  it('when comparing the forms, then full − simplified = PaCO2 × FiO2 × (1 − R)/R (≈ 2 mmHg in air)', () => {
    // §2.1: F = PACO2 × FIO2 × (1 − R)/R; 40 × 0.21 × 0.2/0.8 ≈ 2 [C physiology notes]
    fc.assert(
      fc.property(
        fc.double({ min: 0.21, max: 1, noNaN: true }),
        fc.double({ min: 300, max: 800, noNaN: true }),
        fc.double({ min: 20, max: 80, noNaN: true }),
        fc.double({ min: 0.7, max: 1, noNaN: true }),
        (fio2, pressureMmHg, paco2MmHg, r) => {
          const input = { fio2, pressureMmHg, paco2MmHg, respiratoryExchangeRatio: r };
          const f = (paco2MmHg * fio2 * (1 - r)) / r;
          expect(alveolarPo2FullMmHg(input) - alveolarPo2SimplifiedMmHg(input)).toBeCloseTo(f, 9);
        },
      ),
    );
    const air = { fio2: 0.21, pressureMmHg: 760, paco2MmHg: 40 };
    expect(alveolarPo2FullMmHg(air) - alveolarPo2SimplifiedMmHg(air)).toBeCloseTo(2.1, 6);
  });

  it('when PaO2 is 90 mmHg with PAO2 101.8, then the A–a gradient is 11.8 mmHg', () => {
    // computed from A–a gradient = PAO2 − PaO2 (§2.1)
    const alveolar = alveolarPo2FullMmHg({ fio2: 0.21, pressureMmHg: 760, paco2MmHg: 40 });
    expect(alveolarArterialGradientMmHg(alveolar, 90)).toBeCloseTo(11.83, 2);
  });
});

// §2.3 check values [X] (ISA geopotential pressures, 47 mmHg): air at destination as a sea-level FiO2,
// FiO2 needed to equal sea-level 0.21, and sea-level 0.30 carried to the destination, each wet / dry.
const TABLE_2_3 = [
  { place: '1000 m', pb: 674.11, air: [0.1847, 0.1863], need: [0.2388, 0.2368], carry: [0.3411, 0.3382] },
  { place: '1800 m', pb: 611.22, air: [0.1662, 0.1689], need: [0.2654, 0.2611], carry: [0.3791, 0.373] },
  { place: '2000 m', pb: 596.26, air: [0.1618, 0.1648], need: [0.2726, 0.2677], carry: [0.3894, 0.3824] },
  { place: '8000 ft', pb: 564.51, air: [0.1524, 0.156], need: [0.2893, 0.2827], carry: [0.4133, 0.4039] },
  { place: '3000 m', pb: 525.86, air: [0.141, 0.1453], need: [0.3127, 0.3035], carry: [0.4467, 0.4336] },
];

describe('FiO2 equivalence between pressures', () => {
  it.each(TABLE_2_3)('when the destination is $place ($pb mmHg), then wet and dry forms match §2.3', (row) => {
    // docs/clinical-sources.md §2.3 table [X]; wet form [C neonatal altitude page], dry form [C medical reference page]
    expect(equivalentFio2(0.21, row.pb, 760, 'wet')).toBeCloseTo(row.air[0], 4);
    expect(equivalentFio2(0.21, row.pb, 760, 'dry')).toBeCloseTo(row.air[1], 4);
    expect(equivalentFio2(0.21, 760, row.pb, 'wet')).toBeCloseTo(row.need[0], 4);
    expect(equivalentFio2(0.21, 760, row.pb, 'dry')).toBeCloseTo(row.need[1], 4);
    expect(equivalentFio2(0.3, 760, row.pb, 'wet')).toBeCloseTo(row.carry[0], 4);
    expect(equivalentFio2(0.3, 760, row.pb, 'dry')).toBeCloseTo(row.carry[1], 4);
  });

  it('when no form is named, then the wet (PIO2-constant) form is used', () => {
    // §10 #13: sea-level 0.21 → 1800 m is 0.2654 wet (dry would be 0.2611) [X]
    expect(equivalentFio2(0.21, 760, 611.22)).toBeCloseTo(0.2654, 4);
  });

  it('when air is breathed in an 8000 ft cabin, then it equals about 15% oxygen at sea level', () => {
    // §2.3 and §10 #12: 0.152 [X]; the hypoxic challenge test uses 15% O2 at sea level
    // [C Vetter-Laracy et al. Pediatrics 2016;137(3):e20152915; Hall et al. Thorax 2007]
    const cabinMmHg = resolvePressure({ elevationFt: 8000 }).pressureMmHg;
    expect(equivalentFio2(0.21, cabinMmHg, 760)).toBeCloseTo(0.152, 3);
  });

  it('when carried there and back, then the wet form keeps PIO2 and returns the original FiO2', () => {
    // computed from FiO2₂ = FiO2₁ × (PB₁ − 47)/(PB₂ − 47): the ratio inverts exactly
    fc.assert(
      fc.property(
        fc.double({ min: 0.21, max: 1, noNaN: true }),
        fc.double({ min: 300, max: 800, noNaN: true }),
        fc.double({ min: 300, max: 800, noNaN: true }),
        (fio2, fromMmHg, toMmHg) => {
          const there = equivalentFio2(fio2, fromMmHg, toMmHg);
          expect(inspiredPo2MmHg(there, toMmHg)).toBeCloseTo(inspiredPo2MmHg(fio2, fromMmHg), 9);
          expect(equivalentFio2(there, toMmHg, fromMmHg)).toBeCloseTo(fio2, 12);
        },
      ),
    );
  });

  it('when going up, then the dry form asks for less oxygen than the wet form', () => {
    // §2.3: "the dry form gives slightly lower FiO2 at altitude"
    expect(equivalentFio2(0.3, 760, 596.26, 'dry')).toBeLessThan(equivalentFio2(0.3, 760, 596.26, 'wet'));
  });
});
