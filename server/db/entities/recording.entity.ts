import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { DesaturationEvent } from '@shared/clinical/oximetry-events';
import type { RecordingStatus } from '@shared/schemas/recordings';

/**
 * One uploaded overnight recording and, once analysed, its summary. The samples live apart in
 * recording_samples so that lists and detail reads never load them.
 */
@Entity({ name: 'recordings' })
export class RecordingEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'text' }) status: RecordingStatus;
  /** As the uploader's computer named it, cleaned; shown to staff only, never used as a path. */
  @Column({ type: 'text', name: 'file_name' }) fileName: string;
  /** SHA-256 of the original bytes: proves which file was analysed and makes a retried upload a no-op. */
  @Column({ type: 'text' }) sha256: string;
  @Column({ type: 'integer', name: 'byte_size' }) byteSize: number;
  @Column({ type: 'text', name: 'time_format' }) timeFormat: 'iso' | 'seconds';
  @Column({ type: 'timestamptz', name: 'started_at', nullable: true }) startedAt: Date | null;
  @Column({ type: 'double precision', name: 'duration_sec' }) durationSec: number;
  @Column({ type: 'integer', name: 'sample_count' }) sampleCount: number;
  @Column({ type: 'double precision', name: 'sample_period_sec' }) samplePeriodSec: number;
  @Column({ type: 'integer', name: 'skipped_rows' }) skippedRows: number;
  @Column({ type: 'text', name: 'analysis_version', nullable: true }) analysisVersion: string | null;
  // Summary columns: double precision keeps each value exactly as the analysis computed it.
  @Column({ type: 'double precision', name: 'valid_minutes', nullable: true }) validMinutes: number | null;
  @Column({ type: 'double precision', name: 'mean_spo2', nullable: true }) meanSpo2: number | null;
  @Column({ type: 'double precision', name: 'median_spo2', nullable: true }) medianSpo2: number | null;
  @Column({ type: 'double precision', name: 'min_spo2', nullable: true }) minSpo2: number | null;
  @Column({ type: 'double precision', name: 'pct_below_90', nullable: true }) pctBelow90: number | null;
  @Column({ type: 'double precision', name: 'pct_below_92', nullable: true }) pctBelow92: number | null;
  @Column({ type: 'double precision', name: 'pct_below_93', nullable: true }) pctBelow93: number | null;
  @Column({ type: 'double precision', nullable: true }) odi3: number | null;
  @Column({ type: 'double precision', nullable: true }) odi4: number | null;
  @Column({ type: 'double precision', name: 'mean_pulse', nullable: true }) meanPulse: number | null;
  /** False when the valid time was below the programme's minimum: too short to judge, counts for nothing. */
  @Column({ type: 'boolean', nullable: true }) judged: boolean | null;
  @Column({ type: 'double precision', name: 'min_event_seconds', nullable: true }) minEventSeconds: number | null;
  @Column({ type: 'double precision', name: 'min_valid_minutes', nullable: true }) minValidMinutes: number | null;
  /** The ODI3 events, for marking on the chart. */
  @Column({ type: 'jsonb', nullable: true }) events: DesaturationEvent[] | null;
  @Column({ type: 'text', name: 'failure_reason', nullable: true }) failureReason: string | null;
  @Column({ type: 'uuid', name: 'uploaded_by' }) uploadedBy: string;
  @Column({ type: 'timestamptz', name: 'uploaded_at', default: () => 'now()' }) uploadedAt: Date;
  @Column({ type: 'timestamptz', name: 'analysed_at', nullable: true }) analysedAt: Date | null;
  /** Moved on every status change: the reconciler finds recordings stuck in a state by it. */
  @Column({ type: 'timestamptz', name: 'status_at', default: () => 'now()' }) statusAt: Date;
}
