import { useId } from 'react';
import { useFormContext } from 'react-hook-form';

/**
 * The server asked for an unusual weight to be checked (under 1 kg, or more than 20 % from a recent weight): the
 * reasons in words and a box the person ticks before saving again. Nothing is saved until then.
 */
export function WeightConfirm({ warnings, name }: { warnings: readonly string[]; name: string }) {
  const id = useId();
  const { register } = useFormContext();
  return (
    <div role="alert" className="flex flex-col gap-2 rounded-lg border-2 border-warn-600 bg-warn-50 p-3 text-warn-800">
      <p className="font-bold">Check the weight before saving</p>
      <ul className="list-inside list-disc">
        {warnings.map((w) => <li key={w}>{w}</li>)}
      </ul>
      <label htmlFor={id} className="flex min-h-11 items-center gap-3 font-semibold text-ink-900">
        <input id={id} type="checkbox" className="size-5" {...register(name)} />
        I have checked: this weight is right
      </label>
    </div>
  );
}
