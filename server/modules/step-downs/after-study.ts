import { hoursOneDecimal } from '@shared/clinical/units';
import { DEFAULT_MIN_VALID_MINUTES } from '@shared/clinical/oximetry';
import type { DataSource } from 'typeorm';
import type { AppRepos } from '../../deps';
import { createStepDownsService } from './step-downs.service';

/**
 * Once an overnight recording is analysed: it completes the baby's earliest open overnight study or room-air
 * challenge, and its result may propose the next step (down, back up, or leaving the programme).
 */
export async function afterStudy(ds: DataSource, repos: AppRepos, recordingId: string) {
  const recording = await ds.transaction(async (m) => {
    const r = await repos.recordings.findForUpdate(recordingId, m);
    if (!r || r.status !== 'done') return null;
    const [open] = await repos.checks.openOfKinds(r.infantId, ['overnight_study', 'room_air_challenge'], m);
    if (open && r.judged === false) {
      // Too short to judge: the planned study stays open and says a repeat is needed (the nurse's day shows it).
      const hours = hoursOneDecimal(r.minValidMinutes ?? DEFAULT_MIN_VALID_MINUTES);
      const when = (r.startedAt ?? r.uploadedAt).toISOString().slice(0, 10);
      await repos.checks.setNote(open.id, `Repeat needed: the recording of ${when} had less than ${hours} hours of valid time, too short to judge.`, m);
    } else if (open && !(await repos.checks.isDoneRefUsed(`recording:${r.id}`, m))) {
      await repos.checks.complete(open, r.uploadedBy, `recording:${r.id}`, m);
    }
    return r;
  });
  if (!recording || recording.validMinutes === null) return null;
  const proposal = await createStepDownsService(ds, repos).considerStudy(recording.infantId, {
    recordingId: recording.id,
    recordedAt: recording.startedAt ?? recording.uploadedAt,
    meanSpo2: recording.meanSpo2,
    pctBelow90: recording.pctBelow90,
    validMinutes: recording.validMinutes,
  });
  return { infantId: recording.infantId, proposal };
}
