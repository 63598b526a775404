/**
 * Number boxes in react-hook-form: an empty box is "not given" (undefined), so the shared schema answers
 * "Enter …" rather than accepting 0 or failing on NaN.
 */
export const asNumber = {
  setValueAs: (value: unknown) => (value === '' || value === null || value === undefined ? undefined : Number(value)),
};
