import { PlaceholderPage } from './placeholder-page';

export function Component() {
  return (
    <PlaceholderPage
      title="Sign-off queue"
      intro="Proposed home settings, step-downs and journey plans waiting for a consultant's decision."
      empty="Nothing is waiting for sign-off."
    />
  );
}
