import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { Role } from '@shared/auth/roles';

@Entity({ name: 'users' })
@Index('users_p_role_name_idx', ['programmeId', 'role', 'name', 'id'])
export class UserEntity {
  @PrimaryGeneratedColumn('uuid')
  id: string;

  @Column({ type: 'uuid', name: 'programme_id' })
  programmeId: string;

  /** Stored lower-cased; unique across the installation so sign-in needs no programme. */
  @Column({ type: 'text', unique: true })
  email: string;

  @Column({ type: 'text' })
  name: string;

  @Column({ type: 'text' })
  role: Role;

  /** Null until the person sets a password from their set-up link. */
  @Column({ type: 'text', name: 'password_hash', nullable: true })
  passwordHash: string | null;

  @Column({ type: 'timestamptz', name: 'password_changed_at', nullable: true })
  passwordChangedAt: Date | null;

  @Column({ type: 'boolean', default: false })
  disabled: boolean;

  @Column({ type: 'timestamptz', name: 'disabled_at', nullable: true })
  disabledAt: Date | null;

  @Column({ type: 'timestamptz', name: 'last_sign_in_at', nullable: true })
  lastSignInAt: Date | null;

  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' })
  updatedAt: Date;
}
