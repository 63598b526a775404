import { z } from 'zod';

// The names follow the HTTP-style classes; each fake decides what they mean for its own protocol.
// 'accept-timeout' keeps the message (the provider accepted it) and then never answers: the crash window between
// "accepted" and "recorded as sent" that the fault drills exercise.
export const failRequestSchema = z.object({
  mode: z.enum(['none', '5xx', '4xx', 'timeout', 'accept-timeout']),
  count: z.number().int().min(1).optional(),
});

export type FailRequest = z.infer<typeof failRequestSchema>;
export type FailMode = FailRequest['mode'];

export interface FailureSwitch {
  set(request: FailRequest): void;
  state(): { mode: FailMode; remaining: number | null };
  /** Consumes one failure: `count` is a number of provider transactions, not of HTTP calls to the fake. */
  next(): FailMode;
}

export function createFailureSwitch(): FailureSwitch {
  let mode: FailMode = 'none';
  let remaining: number | null = null;
  return {
    set(request) {
      mode = request.mode;
      remaining = request.mode === 'none' ? null : (request.count ?? null);
    },
    state: () => ({ mode, remaining }),
    next() {
      const current = mode;
      if (current !== 'none' && remaining !== null) {
        remaining -= 1;
        if (remaining <= 0) {
          mode = 'none';
          remaining = null;
        }
      }
      return current;
    },
  };
}
