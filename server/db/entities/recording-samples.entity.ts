import { Column, Entity, PrimaryColumn } from 'typeorm';

/**
 * All samples of one recording in a single row (docs/service-targets.md: never one row per sample). The four bytea columns
 * are parallel little-endian arrays, one entry per sample in time order; `layout` names the encoding, whose
 * definition is shared/recordings/sample-codec.ts. Layout 1:
 *   offsets  Int32   milliseconds from the earliest sample
 *   spo2     Uint16  tenths of a percent; 0xFFFF = missing, 0xFFFE = a number outside 0–6553.3
 *   pulse    Uint16  tenths of a beat per minute; the same two codes
 *   flags    Uint8   bit 0 = flagged by the device
 * A 12 h night at 1 Hz is one row of 389 kB, stored out of line and lz4-compressed to about 280 kB.
 */
@Entity({ name: 'recording_samples' })
export class RecordingSamplesEntity {
  @PrimaryColumn({ type: 'uuid', name: 'recording_id' }) recordingId: string;
  @Column({ type: 'smallint' }) layout: number;
  @Column({ type: 'integer', name: 'sample_count' }) sampleCount: number;
  @Column({ type: 'bytea' }) offsets: Buffer;
  @Column({ type: 'bytea' }) spo2: Buffer;
  @Column({ type: 'bytea' }) pulse: Buffer;
  @Column({ type: 'bytea' }) flags: Buffer;
}
