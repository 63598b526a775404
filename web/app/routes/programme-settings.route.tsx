import { PageHeader } from '../../components/ui/page-header';
import { PolicyPage } from '../../features/policy/components/policy-page';
import { useAppAbility } from '../../lib/ability';

export function Component() {
  const ability = useAppAbility();
  return (
    <>
      <PageHeader
        title="Programme settings"
        intro="Saturation targets, the check schedule, stepping down and the equipment your programme uses. Each save is a new version; checks are planned again from it."
      />
      <PolicyPage readOnly={!ability.can('update', 'Policy')} />
    </>
  );
}
