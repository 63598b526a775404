import type { MonthCount } from '@shared/schemas/overview';
import { Card } from '../../../components/ui/card';
import { MonthBarsChart } from '../../charts/components/month-bars-chart';
import { monthName } from '../../charts/components/month-bars';

/** The sentence a screen reader hears instead of the bars, and everyone reads under them. */
export function onOxygenSummary(months: readonly MonthCount[]): string {
  if (months.length === 0) return 'No months to show.';
  const first = months[0];
  const last = months[months.length - 1];
  const span = `${monthName(first.month)} to ${monthName(last.month)}`;
  if (months.every((m) => m.count === 0)) return `No baby was on home oxygen from ${span}.`;
  const highest = months.reduce((best, m) => (m.count > best.count ? m : best), first);
  return `Babies on home oxygen at any time in each month, ${span}. Most: ${highest.count} in ${monthName(highest.month)}. This month so far: ${last.count}.`;
}

export function OnOxygenCard({ months }: { months: readonly MonthCount[] }) {
  return (
    <Card title="Babies on home oxygen by month" className="lg:col-span-2">
      <MonthBarsChart months={months} valueLabel="Babies" description={onOxygenSummary(months)} />
    </Card>
  );
}
