import { Button } from './button';

/**
 * Someone else saved the same record first (409): say so and offer to load their version. `large` is the family
 * pages' size; staff pages use the compact one.
 */
export function ConflictNotice({ message, actionLabel, onReload, large = false }: { message: string; actionLabel: string; onReload: () => void; large?: boolean }) {
  return (
    <div role="alert" className={large
      ? 'flex flex-col gap-3 rounded-xl border-2 border-warn-600 bg-warn-50 p-4 text-warn-800'
      : 'flex flex-col gap-2 rounded-lg border border-warn-200 bg-warn-50 p-3 text-warn-800'}>
      <p className={large ? 'text-xl font-semibold' : 'font-semibold'}>{message}</p>
      <div>
        <Button variant="secondary" size={large ? 'lg' : 'sm'} onClick={onReload}>{actionLabel}</Button>
      </div>
    </div>
  );
}
