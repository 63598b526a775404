import { PlaceholderPage } from './placeholder-page';

export function Component() {
  return (
    <PlaceholderPage
      title="Caseload"
      intro="Babies in the programme, with their current oxygen plan and next check."
      empty="Nothing here yet: enrolled babies will appear here."
    />
  );
}
