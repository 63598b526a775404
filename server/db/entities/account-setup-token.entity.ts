import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A set-up link: only the SHA-256 of its secret is kept; single use, expiring, revoked by a newer one. */
@Entity({ name: 'account_setup_tokens' })
export class AccountSetupTokenEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'user_id' }) userId: string;
  @Column({ type: 'text', name: 'token_hash' }) tokenHash: string;
  @Column({ type: 'uuid', name: 'created_by', nullable: true }) createdBy: string | null;
  @Column({ type: 'timestamptz', name: 'expires_at' }) expiresAt: Date;
  @Column({ type: 'timestamptz', name: 'used_at', nullable: true }) usedAt: Date | null;
  @Column({ type: 'timestamptz', name: 'revoked_at', nullable: true }) revokedAt: Date | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
}
