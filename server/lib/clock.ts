/** The time source; tests pass a fixed clock so nothing depends on when they run. */
export interface Clock {
  now(): Date;
}
export const systemClock: Clock = { now: () => new Date() };
export const fixedClock = (at: Date | string): Clock => ({ now: () => new Date(at) });
