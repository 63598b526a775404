import { PlaceholderPage } from './placeholder-page';

export function Component() {
  return (
    <PlaceholderPage
      title="Programme settings"
      intro="Saturation targets, the visit and check schedule, and the flowmeter steps your equipment offers."
      empty="Nothing here yet: programme settings will be editable here."
    />
  );
}
