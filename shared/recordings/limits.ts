/** What one overnight recording upload may be. The web shows these; the API and the parser enforce them. */
export const RECORDING_LIMITS = Object.freeze({
  /** 26 h at 1 Hz in our format is about 4 MB; 20 MB leaves room for wordier exports and faster devices. */
  maxFileBytes: 20 * 1024 * 1024,
  /** About a minute at one reading a second: less cannot give a meaningful summary. */
  minSamples: 60,
  /** One night with margin; longer files are usually several nights joined together. */
  maxDurationHours: 26,
  /** Share of data rows that may be unreadable and skipped (a stray device note) before the file is refused. */
  unreadableRowShare: 0.01,
});

/** `local`: a date and clock time in the device's time zone, without an offset. */
export const RECORDING_TIME_FORMATS = ['iso', 'seconds', 'local', 'auto'] as const;
export type RecordingTimeFormat = (typeof RECORDING_TIME_FORMATS)[number];
