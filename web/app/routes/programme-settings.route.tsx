import { PageHeader } from '../../components/ui/page-header';
import { PolicyPage } from '../../features/policy/components/policy-page';
import { useAppAbility } from '../../lib/ability';
import { usePageTitle } from '../../lib/page-title';

export function Component() {
  const ability = useAppAbility();
  usePageTitle('Programme settings');
  return (
    <>
      <PageHeader
        title="Programme settings"
        intro="Saturation targets, the check schedule, stepping down, the equipment and cylinders your programme uses, the numbers families call and when messages go out. Each save is a new version; checks are planned again from it."
      />
      <PolicyPage readOnly={!ability.can('update', 'Policy')} />
    </>
  );
}
