/** A concentrator's flow range as ordered or delivered (L/min); either end may be unknown. */
export interface FlowRange {
  flowMinLpm?: number;
  flowMaxLpm?: number;
}

/**
 * The lowest and highest flow an approved setting asks for across the day (its main flow and each part of the day;
 * 0 = off, left out), or null when it asks for none.
 */
export function settingFlowRange(approvedFlowLpm: number | null, periods: Record<string, number> | null): { low: number; high: number } | null {
  const flows = [approvedFlowLpm ?? 0, ...Object.values(periods ?? {})].filter((f) => f > 0);
  return flows.length ? { low: Math.min(...flows), high: Math.max(...flows) } : null;
}

/** Whether a setting asks for no oxygen at any part of the day (the last step down). */
export const asksForNoOxygen = (approvedFlowLpm: number | null, periods: Record<string, number> | null): boolean =>
  settingFlowRange(approvedFlowLpm, periods) === null;

/** Whether an installed concentrator can give every flow of the setting; unknown when its range is not recorded. */
export function concentratorCovers(concentrator: FlowRange, need: { low: number; high: number }): boolean | null {
  if (concentrator.flowMinLpm === undefined || concentrator.flowMaxLpm === undefined) return null;
  return need.low >= concentrator.flowMinLpm && need.high <= concentrator.flowMaxLpm;
}
