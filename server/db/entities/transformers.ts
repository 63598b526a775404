import type { ValueTransformer } from 'typeorm';

// pg returns numeric columns as strings to avoid precision loss; clinical values here fit a double exactly enough.
export const numeric: ValueTransformer = {
  to: (v: number | null | undefined) => v,
  from: (v: string | null) => (v === null || v === undefined ? null : Number(v)),
};
