import { z } from 'zod';
import { CONVERSION_WARNING_CODES } from '../clinical/conversion-warnings';
import type { PressureSource } from '../clinical/pressure';
import { METRES_PER_FOOT } from '../clinical/units';

// Inputs accepted by the preview: the elevation range covers inhabited land with margin (Dead Sea shore to high
// Andean towns); the pressure range covers those elevations plus weather.
const ELEVATION_MIN_M = -500;
const ELEVATION_MAX_M = 6000;

// zod 4 numbers already refuse NaN and ±Infinity; the message covers those and non-numbers alike.
const finite = (message: string) => z.number({ error: message });

const elevationMSchema = finite('Elevation must be a number of metres')
  .min(ELEVATION_MIN_M, { error: 'Elevation must be at least -500 m' })
  .max(ELEVATION_MAX_M, { error: 'Elevation must be at most 6000 m' });

const elevationFtSchema = finite('Elevation must be a number of feet')
  .min(ELEVATION_MIN_M / METRES_PER_FOOT, { error: 'Elevation must be at least -1640 ft (-500 m)' })
  .max(ELEVATION_MAX_M / METRES_PER_FOOT, { error: 'Elevation must be at most 19685 ft (6000 m)' });

const pressureMmHgSchema = finite('Pressure must be a number of mmHg')
  .min(300, { error: 'Pressure must be at least 300 mmHg' })
  .max(800, { error: 'Pressure must be at most 800 mmHg' });

const PLACE_KEYS = ['elevationM', 'elevationFt', 'pressureMmHg'] as const;
const ONE_PLACE_KEY = 'Give one of: elevation in metres, elevation in feet, or a measured pressure in mmHg';

// Plain wording for the two structural failures; range messages come from the fields themselves.
const objectErrors = (notAnObject: string) => ({
  error: (issue: { code?: string; keys?: string[] }) =>
    issue.code === 'unrecognized_keys' ? `Unknown field: ${(issue.keys ?? []).join(', ')}` : notAnObject,
});

/**
 * Exactly one of elevationM, elevationFt or pressureMmHg. Written as one strict object plus a count check rather
 * than a union, so a range error points at the field and a missing or doubled key gets one plain message.
 */
export const pressureSourceSchema = z
  .strictObject(
    {
      elevationM: elevationMSchema.optional(),
      elevationFt: elevationFtSchema.optional(),
      pressureMmHg: pressureMmHgSchema.optional(),
    },
    objectErrors(ONE_PLACE_KEY),
  )
  .check((ctx) => {
    const given = PLACE_KEYS.filter((key) => ctx.value[key] !== undefined);
    if (given.length !== 1) {
      ctx.issues.push({ code: 'custom', input: ctx.value, message: ONE_PLACE_KEY });
    }
  })
  .transform((value) => value as PressureSource);

const stepsSchema = z
  .array(finite('Each flowmeter step must be a number').positive({ error: 'Flowmeter steps must be above 0 L/min' }))
  .min(1, { error: 'Give at least one flowmeter step' })
  .max(200, { error: 'At most 200 flowmeter steps' })
  .refine((steps) => steps.every((step, i) => i === 0 || step > steps[i - 1]), {
    error: 'Flowmeter steps must be in ascending order without repeats',
  });

const percentSchema = finite('Source oxygen must be a number of %')
  .min(21, { error: 'Source oxygen must be at least 21 %' })
  .max(100, { error: 'Source oxygen must be at most 100 %' });

export const conversionPreviewBodySchema = z.strictObject(
  {
    weightKg: finite('Weight must be a number of kg')
      .positive({ error: 'Weight must be above 0 kg' })
      .max(15, { error: 'Weight must be at most 15 kg' }),
    flowLpm: finite('Flow must be a number of L/min')
      .min(0, { error: 'Flow cannot be negative' })
      .max(15, { error: 'Flow must be at most 15 L/min' }),
    sourceO2Percent: percentSchema,
    /** Home supply purity when it differs from the hospital's (e.g. a concentrator at home). */
    homeSourceO2Percent: percentSchema.optional(),
    hospital: pressureSourceSchema,
    home: pressureSourceSchema,
    flowmeterStepsLpm: stepsSchema.optional(),
  },
  objectErrors('The request body must be an object'),
);
export type ConversionPreviewBody = z.infer<typeof conversionPreviewBodySchema>;
export type ConversionPreviewBodyInput = z.input<typeof conversionPreviewBodySchema>;

const workingLineSchema = z.object({
  key: z.string(),
  label: z.string(),
  value: z.number().nullable(),
  unit: z.enum(['mmHg', 'm', 'kg', 'L/min', 'fraction', '%']),
  formula: z.string(),
  source: z.string(),
});

const modelNameSchema = z.object({ name: z.string(), version: z.string() });

export const conversionPreviewResponseSchema = z.object({
  hospital: z.object({ pressureMmHg: z.number(), pio2MmHg: z.number(), effectiveFio2: z.number() }),
  home: z.object({
    pressureMmHg: z.number(),
    pio2MmHg: z.number(),
    targetFio2: z.number(),
    requiredFlowLpm: z.number().nullable(),
    roundedFlowLpm: z.number().nullable(),
    deliveredFio2: z.number().nullable(),
  }),
  feasible: z.boolean(),
  warnings: z.array(z.object({ code: z.enum(CONVERSION_WARNING_CODES), message: z.string() })),
  working: z.array(workingLineSchema),
  model: z.object({
    pressure: modelNameSchema,
    cannula: modelNameSchema,
    equivalence: z.literal('wet PIO2-constant'),
    waterVapourMmHg: z.number(),
    version: z.string(),
  }),
});
export type ConversionPreviewResponse = z.infer<typeof conversionPreviewResponseSchema>;
