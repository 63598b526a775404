import { DEFAULT_COUNTRY, formatPhone, isCountryCode } from '@shared/phone/phone';
import { useSignedInUser } from './signed-in-user';

/** Shows a stored (E.164) number the way people here write it: national for the programme's country. */
export function usePhoneText(): (value: string) => string {
  const { programmeCountry } = useSignedInUser();
  const country = isCountryCode(programmeCountry) ? programmeCountry : DEFAULT_COUNTRY;
  return (value) => formatPhone(value, country);
}
