export const cylinderKeys = {
  // Under 'policy', so a newly saved policy version refreshes the cylinder list and the reserve.
  supply: () => ['policy', 'cylinder-supply'] as const,
};
