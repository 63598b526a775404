import type { ConversionModel } from '@shared/clinical/conversion-types';
import type { WorkingLine } from '@shared/clinical/working';
import { formatWorkingValue } from './clinical-format';
import { ScrollRegion } from '../ui/scroll-region';

/** A conversion's lines, or any other worked sheet whose lines name their own unit (a journey's supply sheet). */
type SheetLine = Omit<WorkingLine, 'unit'> & { unit: WorkingLine['unit'] | (string & {}) };

interface WorkingTableProps {
  working: readonly SheetLine[];
  warnings?: readonly { code: string; message: string }[];
  model?: Pick<ConversionModel, 'pressure' | 'cannula' | 'version'> & Partial<ConversionModel>;
  caption?: string;
}

/** The whole worked sheet of a conversion, in the order it was computed, so every line can be redone by hand. */
export function WorkingTable({ working, warnings = [], model, caption = 'How the setting was worked out' }: WorkingTableProps) {
  return (
    <div className="flex flex-col gap-3">
      {warnings.length > 0 && (
        <ul aria-label="Points to check" className="flex flex-col gap-1.5">
          {warnings.map((warning) => (
            <li key={warning.code} className="rounded-lg border border-warn-200 bg-warn-50 px-3 py-2 text-warn-800">
              <span className="font-bold">Check: </span>
              {warning.message}
            </li>
          ))}
        </ul>
      )}
      {/* Narrow containers (a side panel, a phone) show formula and source under the step, so nothing scrolls away;
          screen readers always get the four real columns. */}
      <ScrollRegion label={caption} className="@container relative overflow-x-auto rounded-lg border border-surface-200">
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-surface-100 text-ink-700">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">Step</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Value</th>
              <th scope="col" className="sr-only px-3 py-2 font-semibold @2xl:not-sr-only">Formula</th>
              <th scope="col" className="sr-only px-3 py-2 font-semibold @2xl:not-sr-only">Source or model</th>
            </tr>
          </thead>
          <tbody>
            {working.map((line) => (
              <tr key={line.key} className="border-t border-surface-200 align-top">
                <th scope="row" className="px-3 py-2 font-normal text-ink-900">
                  <span className="font-semibold">{line.label}</span>
                  <span aria-hidden="true" className="mt-0.5 block font-mono text-xs text-ink-700 @2xl:hidden">{line.formula}</span>
                  <span aria-hidden="true" className="block text-xs text-ink-500 @2xl:hidden">{line.source}</span>
                </th>
                <td className="whitespace-nowrap px-3 py-2 text-right tabular-nums text-ink-900">
                  {formatWorkingValue(line.value, line.unit)}
                </td>
                <td className="sr-only px-3 py-2 font-mono text-xs text-ink-700 @2xl:not-sr-only">{line.formula}</td>
                <td className="sr-only px-3 py-2 text-ink-500 @2xl:not-sr-only">{line.source}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
      {model && (
        <dl aria-label="Models used" className="grid gap-x-4 gap-y-1 text-sm text-ink-700 sm:grid-cols-[auto_1fr]">
          <dt className="font-semibold">Air pressure</dt>
          <dd>{model.pressure.name} ({model.pressure.version})</dd>
          <dt className="font-semibold">Cannula</dt>
          <dd>{model.cannula.name} ({model.cannula.version})</dd>
          {model.equivalence && (
            <>
              <dt className="font-semibold">Equivalence</dt>
              <dd>
                {model.equivalence}
                {model.waterVapourMmHg !== undefined && `, water vapour ${model.waterVapourMmHg} mmHg`}
              </dd>
            </>
          )}
          <dt className="font-semibold">Rules version</dt>
          <dd>{model.version}</dd>
        </dl>
      )}
    </div>
  );
}
