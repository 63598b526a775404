import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { numeric } from './transformers';

@Entity({ name: 'sites' })
export class SiteEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'text' }) name: string;
  @Column({ type: 'numeric', precision: 7, scale: 1, name: 'elevation_m', transformer: numeric }) elevationM: number;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
