import { useState } from 'react';
import type { CylinderCheckInput } from '@shared/schemas/journeys';
import { Cautions } from '../../../components/clinical/cautions';
import { Alert } from '../../../components/ui/alert';
import { Card } from '../../../components/ui/card';
import { EmptyState } from '../../../components/ui/empty-state';
import { Spinner } from '../../../components/ui/spinner';
import { errorMessage } from '../../../lib/api-error';
import { useCylinderSupply } from '../api/get-cylinder-supply';
import { CylinderForm } from './cylinder-form';
import { CylinderResult } from './cylinder-result';
import { flowGroups, type SettingFlows } from './flow-groups';

export const NO_APPROVED_FLOW = 'Once the consultant has approved a home oxygen plan, you can work out here how long a cylinder lasts at that flow.';
export const NO_FLOW_IN_PLAN = 'The current plan uses no oxygen, so a cylinder is not being used.';
export const NO_CYLINDERS = 'The programme has not listed its cylinders yet. Ask your home-care team how long yours lasts.';

interface CylinderTimeProps {
  /** The approved setting only; null when there is none yet. */
  setting: SettingFlows | null;
  variant: 'family' | 'staff';
}

/** Pick a cylinder, read its gauge, and see how long it lasts at the approved flow, with the programme's reserve. */
export function CylinderTime({ setting, variant }: CylinderTimeProps) {
  const supply = useCylinderSupply();
  const [checked, setChecked] = useState<{ input: CylinderCheckInput; at: Date } | null>(null);
  const flows = setting ? flowGroups(setting) : [];

  let body;
  if (!setting) body = <EmptyState large message={NO_APPROVED_FLOW} />;
  else if (flows.length === 0) body = <EmptyState large message={NO_FLOW_IN_PLAN} />;
  else if (supply.isPending) body = <Spinner label="Loading the cylinder list" />;
  else if (supply.isError) body = <Alert>{`The cylinder list could not be loaded. ${errorMessage(supply.error)}`}</Alert>;
  else if (supply.data.cylinders.length === 0) body = <EmptyState large message={NO_CYLINDERS} />;
  else {
    const cylinder = checked && supply.data.cylinders.find((c) => c.id === checked.input.cylinderId);
    body = (
      <div className="flex flex-col gap-6">
        <CylinderForm cylinders={supply.data.cylinders} onCheck={(input) => setChecked({ input, at: new Date() })} />
        {checked && cylinder && (
          <CylinderResult cylinder={cylinder} gauge={checked.input.gauge} flows={flows} reservePercent={supply.data.reservePercent} now={checked.at} />
        )}
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-5">
      <Card>{body}</Card>
      <Cautions variant={variant} />
    </div>
  );
}
