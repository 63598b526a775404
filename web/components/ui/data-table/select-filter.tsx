interface SelectFilterProps<T extends string> {
  label: string;
  value: T | undefined;
  options: readonly T[];
  labels: Record<T, string>;
  /** The first choice, which clears the filter. */
  anyLabel: string;
  onChange: (value: T | undefined) => void;
}

export function SelectFilter<T extends string>({ label, value, options, labels, anyLabel, onChange }: SelectFilterProps<T>) {
  // Only a listed value passes, so the empty choice (or anything else) clears the filter.
  const pick = (raw: string) => options.find((option) => option === raw);
  return (
    <label className="flex max-w-full min-w-0 flex-col gap-1 font-semibold">
      {label}
      <select
        value={value ?? ''}
        onChange={(event) => onChange(pick(event.target.value))}
        // A long option (the message statuses) must not push the page wider than a phone.
        className="min-h-11 max-w-full rounded-lg border border-surface-300 bg-surface-0 px-3 font-normal"
      >
        <option value="">{anyLabel}</option>
        {options.map((option) => (
          <option key={option} value={option}>
            {labels[option]}
          </option>
        ))}
      </select>
    </label>
  );
}
