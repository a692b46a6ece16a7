import { useHomeZone } from '../../../components/station-time/use-station-zone';
import { useMe } from '../../session';

/** Training is not tied to a unit: its dates and times are the person's station's (their crew's, or the first). */
export function useTrainingZone() {
  return useHomeZone(useMe().data?.crewId);
}
