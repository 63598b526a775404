import { PlaceholderPage } from './placeholder-page';

export function Component() {
  return (
    <PlaceholderPage
      title="Enrol a baby"
      intro="Take a baby into the programme at discharge: hospital prescription, weight, home elevation, family contacts and equipment."
      empty="Enrolment is not open yet in this installation."
    />
  );
}
