import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { OrderHistoryEntry, OrderItem, OrderPurpose, OrderStatus } from '@shared/schemas/equipment-orders';

/** Stored history lines keep the person's id; names are looked up when shown. */
export type StoredHistoryEntry = Omit<OrderHistoryEntry, 'by'> & { by: string | null; byKind: 'staff' | 'supplier' | 'system' };

/** An order to the programme's oxygen supplier for one baby. */
@Entity({ name: 'equipment_orders' })
export class EquipmentOrderEntity {
  @PrimaryGeneratedColumn('uuid') id: string;
  @Column({ type: 'uuid', name: 'programme_id' }) programmeId: string;
  @Column({ type: 'uuid', name: 'infant_id' }) infantId: string;
  @Column({ type: 'integer' }) seq: number;
  @Column({ type: 'text' }) reference: string;
  @Column({ type: 'text' }) purpose: OrderPurpose;
  @Column({ type: 'text' }) status: OrderStatus;
  @Column({ type: 'jsonb' }) items: OrderItem[];
  @Column({ type: 'date', name: 'needed_by' }) neededBy: string;
  @Column({ type: 'text', name: 'delivery_address' }) deliveryAddress: string;
  @Column({ type: 'text', nullable: true }) note: string | null;
  @Column({ type: 'text', name: 'supplier_email', nullable: true }) supplierEmail: string | null;
  @Column({ type: 'date', name: 'delivery_on', nullable: true }) deliveryOn: string | null;
  @Column({ type: 'timestamptz', name: 'delivered_at', nullable: true }) deliveredAt: Date | null;
  @Column({ type: 'text', name: 'failure_reason', nullable: true }) failureReason: string | null;
  @Column({ type: 'text', name: 'automatic_reason', nullable: true }) automaticReason: string | null;
  @Column({ type: 'jsonb' }) history: StoredHistoryEntry[];
  @Column({ type: 'integer', name: 'row_version' }) rowVersion: number;
  @Column({ type: 'uuid', name: 'created_by', nullable: true }) createdBy: string | null;
  @CreateDateColumn({ type: 'timestamptz', name: 'created_at' }) createdAt: Date;
  @UpdateDateColumn({ type: 'timestamptz', name: 'updated_at' }) updatedAt: Date;
}
