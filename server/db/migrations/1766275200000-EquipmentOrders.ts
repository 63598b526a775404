import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Orders to the programme's oxygen supplier, with their status history (issue 16). */
export class EquipmentOrders1766275200000 implements MigrationInterface {
  name = 'EquipmentOrders1766275200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE TABLE equipment_orders (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      programme_id uuid NOT NULL REFERENCES programmes(id),
      infant_id uuid NOT NULL REFERENCES infants(id) ON DELETE CASCADE,
      seq integer NOT NULL CHECK (seq > 0),
      reference text NOT NULL,
      purpose text NOT NULL CHECK (purpose IN ('delivery','change','collection')),
      status text NOT NULL CHECK (status IN ('drafted','sent','failed','confirmed','delivered','cancelled')),
      items jsonb NOT NULL,
      needed_by date NOT NULL,
      delivery_address text NOT NULL,
      note text,
      supplier_email text,
      delivery_on date,
      delivered_at timestamptz,
      failure_reason text,
      automatic_reason text,
      history jsonb NOT NULL DEFAULT '[]',
      row_version integer NOT NULL DEFAULT 1,
      created_by uuid REFERENCES users(id),
      -- Milliseconds, as JavaScript keeps them, so a page cursor carries the exact value back.
      created_at timestamptz NOT NULL DEFAULT date_trunc('milliseconds', now()),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT equipment_orders_reference_uq UNIQUE (programme_id, reference),
      CONSTRAINT equipment_orders_seq_uq UNIQUE (programme_id, seq),
      CHECK (status <> 'confirmed' OR delivery_on IS NOT NULL),
      CHECK (status <> 'delivered' OR delivered_at IS NOT NULL)
    )`);
    await q.query(`CREATE INDEX equipment_orders_infant_idx ON equipment_orders (infant_id, created_at DESC)`);
    await q.query(`CREATE INDEX equipment_orders_p_created_idx ON equipment_orders (programme_id, created_at DESC, id DESC)`);
    await q.query(`CREATE INDEX equipment_orders_p_status_idx ON equipment_orders (programme_id, status, created_at DESC, id DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE equipment_orders`);
  }
}
