import type { Recording, RecordingTrace } from '@shared/schemas/recordings';
import { hoursMinutes, perHourText, pulseText, shareText, spo2Text } from './recording-format';

/** The chart in one sentence, for its caption and for anyone who cannot see the canvas. */
export function traceDescription(recording: Recording, trace: RecordingTrace): string {
  const s = recording.summary;
  const deep = trace.events.filter((e) => e.deep).length;
  const events = trace.events.length === 1 ? '1 desaturation event' : `${trace.events.length} desaturation events`;
  const figures = s
    ? `mean ${spo2Text(s.meanSpo2)}, lowest ${spo2Text(s.minSpo2)}, ${shareText(s.pctBelow90)} of valid time below ${trace.threshold} %, ` +
      `${events} (ODI3 ${perHourText(s.odi3)}; ${deep} with a fall of 4 points or more)`
    : events;
  return `SpO2 over ${hoursMinutes(recording.durationMinutes)} h: ${figures}. The dashed line marks ${trace.threshold} %; shaded bands mark the events, listed in the table below.`;
}

/** The pulse chart in one sentence: the night's mean and the range the plotted means run over. */
export function pulseDescription(recording: Recording, trace: RecordingTrace): string {
  const means = trace.points.map((p) => p.pulseMean).filter((v): v is number => v !== null);
  if (means.length === 0) return 'No pulse readings in this file.';
  const mean = recording.summary?.meanPulse ?? null;
  return `Pulse over ${hoursMinutes(recording.durationMinutes)} h: ${mean === null ? '' : `mean ${pulseText(mean)}; `}` +
    `plotted means from ${pulseText(Math.min(...means))} to ${pulseText(Math.max(...means))}, on the same time axis as the SpO2 chart.`;
}
