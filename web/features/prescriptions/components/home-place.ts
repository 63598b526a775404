import { formatMmHg } from '../../../components/clinical/clinical-format';
import { numberInWords } from '@shared/format/number-words';

/** The home's air pressure as it was entered: an elevation, or a measured local pressure when there is no elevation. */
export function homePlaceText(homeElevationM: number | null, homePressureMmHg: number): string {
  if (homeElevationM !== null) return `${numberInWords(Number(homeElevationM.toFixed(0)))} m`;
  return `Measured ${formatMmHg(homePressureMmHg)} mmHg`;
}
