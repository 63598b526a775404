const PAGE_SIZES = [10, 25, 50, 100];

/** "Rows per page": the usual sizes, plus the one a hand-edited link asked for, rather than lie about it. */
export function PageSizeSelect({ value, onChange }: { value: number; onChange: (size: number) => void }) {
  const sizes = PAGE_SIZES.includes(value) ? PAGE_SIZES : [...PAGE_SIZES, value].sort((a, b) => a - b);
  return (
    <label className="flex items-center gap-2 text-sm text-ink-700">
      Rows per page
      <select value={value} onChange={(event) => onChange(Number(event.target.value))} className="min-h-9 rounded-lg border border-surface-300 bg-surface-0 px-2">
        {sizes.map((size) => (
          <option key={size} value={size}>
            {size}
          </option>
        ))}
      </select>
    </label>
  );
}
