import { Card } from '../../components/ui/card';
import { EmptyState } from '../../components/ui/empty-state';
import { PageHeader } from '../../components/ui/page-header';
import { usePageTitle } from '../../lib/page-title';

/** An honest page for work that later releases fill: what will be here, and no invented rows. */
export function PlaceholderPage({ title, intro, empty }: { title: string; intro: string; empty: string }) {
  usePageTitle(title);
  return (
    <>
      <PageHeader title={title} intro={intro} />
      <Card>
        <EmptyState message={empty} />
      </Card>
    </>
  );
}
