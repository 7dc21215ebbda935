import { MigrationInterface, QueryRunner } from 'typeorm';

/** Every table the app syncs; each gets the version-bumping trigger. */
export const SYNCED_TABLES = [
  'customers',
  'vehicles',
  'jobs',
  'checklist_items',
  'chips',
  'chip_layers',
  'climate_readings',
  'invoices',
  'masking_items',
  'job_panels',
  'correction_passes',
  'payments',
  'photos',
  'damage_pins',
  'products',
  'stock_movements',
  'quotes',
  'quote_lines',
  'film_readings',
  'signatures',
  'solvent_applications',
  'timers',
];

/**
 * The records of the job and the business. Synced tables share one version sequence, bumped
 * by a trigger on every insert and update so the pull cursor sees every write.
 */
export class BusinessRecords1764600001000 implements MigrationInterface {
  name = 'BusinessRecords1764600001000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`CREATE SEQUENCE "sync_version" AS bigint`);
    await queryRunner.query(`
            CREATE FUNCTION "panelpass_bump_version"() RETURNS trigger LANGUAGE plpgsql AS $$
            BEGIN
              NEW.version := nextval('sync_version');
              IF TG_OP = 'UPDATE' THEN NEW.updated_at := now(); END IF;
              RETURN NEW;
            END $$
        `);
    await queryRunner.query(`
            CREATE TABLE "audit_entries" (
                "id" BIGSERIAL NOT NULL,
                "business_id" uuid NOT NULL,
                "user_id" uuid,
                "command" text NOT NULL,
                "subject_id" uuid,
                "args" jsonb NOT NULL DEFAULT '{}',
                "via" text NOT NULL DEFAULT 'rest',
                "at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_6b1623bcad4d04530b76548d619" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "audit_entries_business_at_idx" ON "audit_entries" ("business_id", "at")
        `);
    await queryRunner.query(`
            CREATE TABLE "customers" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "name" text NOT NULL,
                "email" text,
                "phone" text,
                "address" text NOT NULL DEFAULT '',
                "lat" double precision,
                "lng" double precision,
                "notes" text NOT NULL DEFAULT '',
                CONSTRAINT "PK_133ec679a801fab5e070f73d3ea" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "customers_sync_idx" ON "customers" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "vehicles" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "customer_id" uuid NOT NULL,
                "make" text NOT NULL DEFAULT '',
                "model" text NOT NULL DEFAULT '',
                "year" integer,
                "body_style" text NOT NULL,
                "colour" text NOT NULL DEFAULT '',
                "paint_notes" text NOT NULL DEFAULT '',
                "plate" text,
                CONSTRAINT "PK_18d8646b59304dce4af3a9e35b6" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "vehicles_customer_id_idx" ON "vehicles" ("customer_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "vehicles_sync_idx" ON "vehicles" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "jobs" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "customer_id" uuid NOT NULL,
                "vehicle_id" uuid NOT NULL,
                "quote_id" uuid,
                "address" text NOT NULL DEFAULT '',
                "lat" double precision,
                "lng" double precision,
                "window_start" TIMESTAMP WITH TIME ZONE NOT NULL,
                "window_end" TIMESTAMP WITH TIME ZONE NOT NULL,
                "assigned_tech_id" uuid,
                "stage" text NOT NULL DEFAULT 'booked',
                "condition_notes" text NOT NULL DEFAULT '',
                "notes" text NOT NULL DEFAULT '',
                "price_minor" integer NOT NULL DEFAULT '0',
                "services" text array NOT NULL DEFAULT '{}',
                CONSTRAINT "PK_cf0a6c42b72fcc7f7c237def345" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "jobs_vehicle_id_idx" ON "jobs" ("vehicle_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "jobs_customer_id_idx" ON "jobs" ("customer_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "jobs_assigned_tech_id_idx" ON "jobs" ("assigned_tech_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "jobs_business_id_window_start_idx" ON "jobs" ("business_id", "window_start")
        `);
    await queryRunner.query(`
            CREATE INDEX "jobs_sync_idx" ON "jobs" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "checklist_items" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "stage" text NOT NULL,
                "key" text NOT NULL,
                "label" text NOT NULL,
                "position" integer NOT NULL DEFAULT '0',
                "done" boolean NOT NULL DEFAULT false,
                "done_at" TIMESTAMP WITH TIME ZONE,
                "done_by" uuid,
                CONSTRAINT "checklist_items_job_id_key_key" UNIQUE ("job_id", "key"),
                CONSTRAINT "PK_bae00945a1d4789bd648e583e29" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "checklist_items_job_id_idx" ON "checklist_items" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "checklist_items_sync_idx" ON "checklist_items" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "chips" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "panel_id" uuid,
                "number" integer NOT NULL,
                "size_mm" numeric(5, 1) NOT NULL,
                "product_id" uuid,
                "layers_planned" integer NOT NULL DEFAULT '3',
                "note" text NOT NULL DEFAULT '',
                CONSTRAINT "PK_470474a5680654f7af1a7ddc552" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "chips_job_id_idx" ON "chips" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "chips_sync_idx" ON "chips" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "chip_layers" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "chip_id" uuid NOT NULL,
                "applied_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "product_id" uuid,
                "applied_by" uuid NOT NULL,
                CONSTRAINT "PK_f1db5e4e65fccc014968e3ed216" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "chip_layers_job_id_idx" ON "chip_layers" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "chip_layers_chip_id_idx" ON "chip_layers" ("chip_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "chip_layers_sync_idx" ON "chip_layers" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "climate_readings" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid,
                "air_c" numeric(5, 1) NOT NULL,
                "rh_pct" numeric(4, 1) NOT NULL,
                "surface_c" numeric(5, 1),
                "taken_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "taken_by" uuid NOT NULL,
                CONSTRAINT "PK_eda5c14960acba623ce6d29055e" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "climate_readings_job_id_idx" ON "climate_readings" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "climate_readings_sync_idx" ON "climate_readings" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "invoices" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "number" integer NOT NULL,
                "issued_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "subtotal_minor" integer NOT NULL,
                "tax_minor" integer NOT NULL,
                "total_minor" integer NOT NULL,
                "currency" text NOT NULL DEFAULT 'USD',
                "lines" jsonb NOT NULL DEFAULT '[]',
                CONSTRAINT "invoices_business_id_number_key" UNIQUE ("business_id", "number"),
                CONSTRAINT "PK_668cef7c22a427fd822cc1be3ce" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "invoices_job_id_idx" ON "invoices" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "invoices_sync_idx" ON "invoices" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "masking_items" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "what" text NOT NULL,
                "panel_id" uuid,
                "product_id" uuid,
                "applied_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "remove_by" TIMESTAMP WITH TIME ZONE NOT NULL,
                "removed_at" TIMESTAMP WITH TIME ZONE,
                CONSTRAINT "PK_ee4766fb037450cf88ca311c2d3" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "masking_items_job_id_idx" ON "masking_items" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "masking_items_sync_idx" ON "masking_items" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "job_panels" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "panel_key" text NOT NULL,
                "label" text NOT NULL,
                "band" text NOT NULL,
                "position" integer NOT NULL,
                "substrate" text NOT NULL,
                "finish" text NOT NULL DEFAULT 'clear-coat',
        "hardness" text,
                "state" text NOT NULL DEFAULT 'todo',
                "area_m2" numeric(6, 3) NOT NULL DEFAULT '0',
                "clear_estimate_um" numeric(7, 2),
                "test_spot_note" text NOT NULL DEFAULT '',
                CONSTRAINT "job_panels_job_id_panel_key_key" UNIQUE ("job_id", "panel_key"),
                CONSTRAINT "PK_433f684e28fc8b5fbf69dbfc83b" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "job_panels_job_id_idx" ON "job_panels" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "job_panels_sync_idx" ON "job_panels" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "correction_passes" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "panel_id" uuid NOT NULL,
                "step" text NOT NULL,
                "machine" text NOT NULL,
                "pad" text NOT NULL,
                "product_id" uuid,
                "speed_setting" text NOT NULL DEFAULT '',
                "passes" integer NOT NULL,
                "result" text NOT NULL,
                "note" text NOT NULL DEFAULT '',
                "logged_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "logged_by" uuid NOT NULL,
                CONSTRAINT "PK_129810142e728c8bdf1c0ea7c45" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "correction_passes_panel_id_idx" ON "correction_passes" ("panel_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "correction_passes_job_id_idx" ON "correction_passes" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "correction_passes_sync_idx" ON "correction_passes" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "payments" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid,
                "quote_id" uuid,
                "kind" text NOT NULL,
                "method" text NOT NULL,
                "amount_minor" integer NOT NULL,
                "currency" text NOT NULL DEFAULT 'USD',
                "status" text NOT NULL,
                "op_id" uuid NOT NULL,
                "provider_ref" text,
                "checkout_url" text,
                "failure_reason" text,
                "paid_at" TIMESTAMP WITH TIME ZONE,
                "recorded_by" uuid,
                CONSTRAINT "payments_business_id_op_id_key" UNIQUE ("business_id", "op_id"),
                CONSTRAINT "PK_197ab7af18c93fbb0c9b28b4a59" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "payments_job_id_idx" ON "payments" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "payments_sync_idx" ON "payments" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "blobs" (
                "business_id" uuid NOT NULL,
                "sha256" text NOT NULL,
                "mime" text NOT NULL,
                "bytes" integer NOT NULL,
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                CONSTRAINT "PK_b1bc35b7cfd8dd192b58db29b30" PRIMARY KEY ("business_id", "sha256")
            )
        `);
    await queryRunner.query(`
            CREATE TABLE "photos" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid,
                "vehicle_id" uuid,
                "subject_type" text,
                "subject_id" uuid,
                "kind" text NOT NULL,
                "sha256" text NOT NULL,
                "mime" text NOT NULL,
                "width" integer NOT NULL DEFAULT '0',
                "height" integer NOT NULL DEFAULT '0',
                "bytes" integer NOT NULL DEFAULT '0',
                "caption" text NOT NULL DEFAULT '',
                "taken_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                CONSTRAINT "PK_5220c45b8e32d49d767b9b3d725" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "photos_vehicle_id_idx" ON "photos" ("vehicle_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "photos_job_id_idx" ON "photos" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "photos_sync_idx" ON "photos" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "damage_pins" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "number" integer NOT NULL,
                "x" double precision NOT NULL,
                "y" double precision NOT NULL,
                "panel_key" text,
                "kind" text NOT NULL,
                "severity" integer NOT NULL DEFAULT '1',
                "note" text NOT NULL DEFAULT '',
                "photo_id" uuid,
                CONSTRAINT "PK_788d7d19f75fb2d1d247dfdb0c4" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "damage_pins_job_id_idx" ON "damage_pins" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "damage_pins_sync_idx" ON "damage_pins" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "products" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "name" text NOT NULL,
                "kind" text NOT NULL,
                "properties" jsonb NOT NULL DEFAULT '{}',
                "unit" text NOT NULL DEFAULT 'mL',
                "stock_qty" numeric(12, 3) NOT NULL DEFAULT '0',
                "amount_per_use" numeric(10, 3) NOT NULL DEFAULT '0',
                "unit_cost_minor" numeric(12, 4) NOT NULL DEFAULT '0',
                "low_stock_at" numeric(12, 3) NOT NULL DEFAULT '0',
                "sds_url" text,
                CONSTRAINT "PK_0806c755e0aca124e67c0cf6d7d" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "products_sync_idx" ON "products" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "stock_movements" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "product_id" uuid NOT NULL,
                "qty" numeric(12, 3) NOT NULL,
                "reason" text NOT NULL,
                "job_id" uuid,
                "source_type" text,
                "source_id" uuid,
                "unit_cost_minor" numeric(12, 4) NOT NULL DEFAULT '0',
                CONSTRAINT "stock_movements_source_type_source_id_product_id_key" UNIQUE ("source_type", "source_id", "product_id"),
                CONSTRAINT "PK_57a26b190618550d8e65fb860e7" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "stock_movements_job_id_idx" ON "stock_movements" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "stock_movements_product_id_idx" ON "stock_movements" ("product_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "stock_movements_sync_idx" ON "stock_movements" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "quotes" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "customer_id" uuid NOT NULL,
                "vehicle_id" uuid NOT NULL,
                "status" text NOT NULL DEFAULT 'draft',
                "inputs" jsonb NOT NULL DEFAULT '{}',
                "subtotal_minor" integer NOT NULL DEFAULT '0',
                "discount_minor" integer NOT NULL DEFAULT '0',
                "tax_minor" integer NOT NULL DEFAULT '0',
                "total_minor" integer NOT NULL DEFAULT '0',
                "deposit_minor" integer NOT NULL DEFAULT '0',
                "labour_hours" numeric(6, 2) NOT NULL DEFAULT '0',
                "currency" text NOT NULL DEFAULT 'USD',
                "valid_until" TIMESTAMP WITH TIME ZONE,
                "sent_at" TIMESTAMP WITH TIME ZONE,
                "accepted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid,
                CONSTRAINT "PK_99a0e8bcbcd8719d3a41f23c263" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "quotes_customer_id_idx" ON "quotes" ("customer_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "quotes_sync_idx" ON "quotes" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "quote_lines" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "quote_id" uuid NOT NULL,
                "position" integer NOT NULL,
                "kind" text NOT NULL,
                "description" text NOT NULL,
                "quantity" numeric(10, 3) NOT NULL DEFAULT '1',
                "unit_price_minor" integer NOT NULL,
                "amount_minor" integer NOT NULL,
                CONSTRAINT "PK_4589e13e3a55c06472a7dee6e31" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "quote_lines_quote_id_idx" ON "quote_lines" ("quote_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "quote_lines_sync_idx" ON "quote_lines" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "film_readings" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "panel_id" uuid NOT NULL,
                "phase" text NOT NULL DEFAULT 'before',
                "readings_um" double precision array NOT NULL,
                "unit" text NOT NULL DEFAULT 'um',
                "gauge_type" text NOT NULL,
                "taken_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "taken_by" uuid NOT NULL,
                CONSTRAINT "PK_a8fa064c20e5f1ae44e3108c426" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "film_readings_panel_id_idx" ON "film_readings" ("panel_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "film_readings_job_id_idx" ON "film_readings" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "film_readings_sync_idx" ON "film_readings" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "signatures" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid,
                "quote_id" uuid,
                "kind" text NOT NULL,
                "signer_name" text NOT NULL,
                "image_sha256" text NOT NULL,
                "record_hash" text NOT NULL,
                "record" jsonb NOT NULL,
                "signed_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                CONSTRAINT "PK_f56eb3cd344ce7f9ae28ce814eb" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "signatures_quote_id_idx" ON "signatures" ("quote_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "signatures_job_id_idx" ON "signatures" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "signatures_sync_idx" ON "signatures" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "solvent_applications" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid NOT NULL,
                "panel_id" uuid,
                "product_id" uuid,
                "surface_temp_c" numeric(5, 1) NOT NULL,
                "in_sun" boolean NOT NULL DEFAULT false,
                "applied_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "flush_by" TIMESTAMP WITH TIME ZONE NOT NULL,
                "flushed_at" TIMESTAMP WITH TIME ZONE,
                "applied_by" uuid NOT NULL,
                CONSTRAINT "PK_6f0ef8735e5645aabac662136d1" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "solvent_applications_job_id_idx" ON "solvent_applications" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "solvent_applications_sync_idx" ON "solvent_applications" ("business_id", "version")
        `);
    await queryRunner.query(`
            CREATE TABLE "timers" (
                "id" uuid NOT NULL,
                "business_id" uuid NOT NULL,
                "version" bigint NOT NULL DEFAULT nextval('sync_version'),
                "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(),
                "deleted_at" TIMESTAMP WITH TIME ZONE,
                "job_id" uuid,
                "kind" text NOT NULL,
                "subject_type" text,
                "subject_id" uuid,
                "label" text NOT NULL,
                "started_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "ends_at" TIMESTAMP WITH TIME ZONE NOT NULL,
                "paused_ms" bigint NOT NULL DEFAULT '0',
                "paused_at" TIMESTAMP WITH TIME ZONE,
                "acknowledged_at" TIMESTAMP WITH TIME ZONE,
                "cancelled_at" TIMESTAMP WITH TIME ZONE,
                "started_by" uuid NOT NULL,
                CONSTRAINT "PK_d13ea0d2fe75274ca5a9576aae6" PRIMARY KEY ("id")
            )
        `);
    await queryRunner.query(`
            CREATE INDEX "timers_business_id_ends_at_idx" ON "timers" ("business_id", "ends_at")
        `);
    await queryRunner.query(`
            CREATE INDEX "timers_job_id_idx" ON "timers" ("job_id")
        `);
    await queryRunner.query(`
            CREATE INDEX "timers_sync_idx" ON "timers" ("business_id", "version")
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses"
            ADD "settings" jsonb NOT NULL DEFAULT '{}'
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses"
            ADD "timezone" text NOT NULL DEFAULT 'UTC'
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses"
            ADD "currency" text NOT NULL DEFAULT 'USD'
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses"
            ADD "next_invoice_number" integer NOT NULL DEFAULT '1'
        `);
    await queryRunner.query(`
            ALTER TABLE "users"
            ADD "customer_id" uuid
        `);
    await queryRunner.query(`
            ALTER TABLE "customers"
            ADD CONSTRAINT "FK_c04b1ab3076e753f96c64318286" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "vehicles"
            ADD CONSTRAINT "FK_dd6ead0071e6f40d6878306d07e" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "vehicles"
            ADD CONSTRAINT "FK_vehicles_customer_id" FOREIGN KEY ("customer_id") REFERENCES "customers"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs"
            ADD CONSTRAINT "FK_6866bb3c271a60ec9156aa84569" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs"
            ADD CONSTRAINT "FK_jobs_customer_id" FOREIGN KEY ("customer_id") REFERENCES "customers"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs"
            ADD CONSTRAINT "FK_jobs_vehicle_id" FOREIGN KEY ("vehicle_id") REFERENCES "vehicles"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs"
            ADD CONSTRAINT "FK_jobs_assigned_tech_id" FOREIGN KEY ("assigned_tech_id") REFERENCES "users"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "checklist_items"
            ADD CONSTRAINT "FK_846efd6f127cd58725fd25251a5" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "checklist_items"
            ADD CONSTRAINT "FK_checklist_items_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "chips"
            ADD CONSTRAINT "FK_482136e6e59c36b3b84dc22a47d" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "chips"
            ADD CONSTRAINT "FK_chips_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "chip_layers"
            ADD CONSTRAINT "FK_93382ef43020350df94b23f5897" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "chip_layers"
            ADD CONSTRAINT "FK_chip_layers_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "chip_layers"
            ADD CONSTRAINT "FK_chip_layers_chip_id" FOREIGN KEY ("chip_id") REFERENCES "chips"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "climate_readings"
            ADD CONSTRAINT "FK_37e7aeafa2c9921ca5d14402e2e" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "climate_readings"
            ADD CONSTRAINT "FK_climate_readings_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "invoices"
            ADD CONSTRAINT "FK_8f96c84343bd7d6cb4374e9788f" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "invoices"
            ADD CONSTRAINT "FK_invoices_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "masking_items"
            ADD CONSTRAINT "FK_8592ef1fb278a3d61b7e94e1f7c" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "masking_items"
            ADD CONSTRAINT "FK_masking_items_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "job_panels"
            ADD CONSTRAINT "FK_a2c335c892ddd9531319ff5193e" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "job_panels"
            ADD CONSTRAINT "FK_job_panels_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "correction_passes"
            ADD CONSTRAINT "FK_17bd5efb6f67993117a4a2ffd8e" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "correction_passes"
            ADD CONSTRAINT "FK_correction_passes_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "correction_passes"
            ADD CONSTRAINT "FK_correction_passes_panel_id" FOREIGN KEY ("panel_id") REFERENCES "job_panels"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "payments"
            ADD CONSTRAINT "FK_07889d42d0b29705cf4a649576b" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "photos"
            ADD CONSTRAINT "FK_6cc4fcc1cdba422e2ef17b56a5b" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "damage_pins"
            ADD CONSTRAINT "FK_0c519887f4f28baa1b95d2c2b85" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "damage_pins"
            ADD CONSTRAINT "FK_damage_pins_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "products"
            ADD CONSTRAINT "FK_6706ea94d32be01f9272ccc3512" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "stock_movements"
            ADD CONSTRAINT "FK_75ef4414cef17a116b90f56ad12" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "stock_movements"
            ADD CONSTRAINT "FK_stock_movements_product_id" FOREIGN KEY ("product_id") REFERENCES "products"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "quotes"
            ADD CONSTRAINT "FK_1f1872c2d6e3123555911136cd1" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "quotes"
            ADD CONSTRAINT "FK_quotes_customer_id" FOREIGN KEY ("customer_id") REFERENCES "customers"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "quotes"
            ADD CONSTRAINT "FK_quotes_vehicle_id" FOREIGN KEY ("vehicle_id") REFERENCES "vehicles"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "quote_lines"
            ADD CONSTRAINT "FK_455e6b6d55d07047b6982b54d01" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "quote_lines"
            ADD CONSTRAINT "FK_quote_lines_quote_id" FOREIGN KEY ("quote_id") REFERENCES "quotes"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "film_readings"
            ADD CONSTRAINT "FK_6fa4b8b42033fea3815538f8875" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "film_readings"
            ADD CONSTRAINT "FK_film_readings_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "film_readings"
            ADD CONSTRAINT "FK_film_readings_panel_id" FOREIGN KEY ("panel_id") REFERENCES "job_panels"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "signatures"
            ADD CONSTRAINT "FK_c5957e6c99a488114315cdde95e" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "solvent_applications"
            ADD CONSTRAINT "FK_ce027e46122ab54fb75cd259c28" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "solvent_applications"
            ADD CONSTRAINT "FK_solvent_applications_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "timers"
            ADD CONSTRAINT "FK_ae02b53614e4ddeabffef022186" FOREIGN KEY ("business_id") REFERENCES "businesses"("id") ON DELETE CASCADE ON UPDATE NO ACTION
        `);
    await queryRunner.query(`
            ALTER TABLE "timers"
            ADD CONSTRAINT "FK_timers_job_id" FOREIGN KEY ("job_id") REFERENCES "jobs"("id") ON DELETE
            SET NULL ON UPDATE NO ACTION
        `);
    for (const table of SYNCED_TABLES) {
      await queryRunner.query(
        `CREATE TRIGGER "${table}_bump_version" BEFORE INSERT OR UPDATE ON "${table}" FOR EACH ROW EXECUTE FUNCTION panelpass_bump_version()`,
      );
    }
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
            ALTER TABLE "timers" DROP CONSTRAINT "FK_timers_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "timers" DROP CONSTRAINT "FK_ae02b53614e4ddeabffef022186"
        `);
    await queryRunner.query(`
            ALTER TABLE "solvent_applications" DROP CONSTRAINT "FK_solvent_applications_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "solvent_applications" DROP CONSTRAINT "FK_ce027e46122ab54fb75cd259c28"
        `);
    await queryRunner.query(`
            ALTER TABLE "signatures" DROP CONSTRAINT "FK_c5957e6c99a488114315cdde95e"
        `);
    await queryRunner.query(`
            ALTER TABLE "film_readings" DROP CONSTRAINT "FK_film_readings_panel_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "film_readings" DROP CONSTRAINT "FK_film_readings_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "film_readings" DROP CONSTRAINT "FK_6fa4b8b42033fea3815538f8875"
        `);
    await queryRunner.query(`
            ALTER TABLE "quote_lines" DROP CONSTRAINT "FK_quote_lines_quote_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "quote_lines" DROP CONSTRAINT "FK_455e6b6d55d07047b6982b54d01"
        `);
    await queryRunner.query(`
            ALTER TABLE "quotes" DROP CONSTRAINT "FK_quotes_vehicle_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "quotes" DROP CONSTRAINT "FK_quotes_customer_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "quotes" DROP CONSTRAINT "FK_1f1872c2d6e3123555911136cd1"
        `);
    await queryRunner.query(`
            ALTER TABLE "stock_movements" DROP CONSTRAINT "FK_stock_movements_product_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "stock_movements" DROP CONSTRAINT "FK_75ef4414cef17a116b90f56ad12"
        `);
    await queryRunner.query(`
            ALTER TABLE "products" DROP CONSTRAINT "FK_6706ea94d32be01f9272ccc3512"
        `);
    await queryRunner.query(`
            ALTER TABLE "damage_pins" DROP CONSTRAINT "FK_damage_pins_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "damage_pins" DROP CONSTRAINT "FK_0c519887f4f28baa1b95d2c2b85"
        `);
    await queryRunner.query(`
            ALTER TABLE "photos" DROP CONSTRAINT "FK_6cc4fcc1cdba422e2ef17b56a5b"
        `);
    await queryRunner.query(`
            ALTER TABLE "payments" DROP CONSTRAINT "FK_07889d42d0b29705cf4a649576b"
        `);
    await queryRunner.query(`
            ALTER TABLE "correction_passes" DROP CONSTRAINT "FK_correction_passes_panel_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "correction_passes" DROP CONSTRAINT "FK_correction_passes_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "correction_passes" DROP CONSTRAINT "FK_17bd5efb6f67993117a4a2ffd8e"
        `);
    await queryRunner.query(`
            ALTER TABLE "job_panels" DROP CONSTRAINT "FK_job_panels_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "job_panels" DROP CONSTRAINT "FK_a2c335c892ddd9531319ff5193e"
        `);
    await queryRunner.query(`
            ALTER TABLE "masking_items" DROP CONSTRAINT "FK_masking_items_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "masking_items" DROP CONSTRAINT "FK_8592ef1fb278a3d61b7e94e1f7c"
        `);
    await queryRunner.query(`
            ALTER TABLE "invoices" DROP CONSTRAINT "FK_invoices_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "invoices" DROP CONSTRAINT "FK_8f96c84343bd7d6cb4374e9788f"
        `);
    await queryRunner.query(`
            ALTER TABLE "climate_readings" DROP CONSTRAINT "FK_climate_readings_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "climate_readings" DROP CONSTRAINT "FK_37e7aeafa2c9921ca5d14402e2e"
        `);
    await queryRunner.query(`
            ALTER TABLE "chip_layers" DROP CONSTRAINT "FK_chip_layers_chip_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "chip_layers" DROP CONSTRAINT "FK_chip_layers_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "chip_layers" DROP CONSTRAINT "FK_93382ef43020350df94b23f5897"
        `);
    await queryRunner.query(`
            ALTER TABLE "chips" DROP CONSTRAINT "FK_chips_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "chips" DROP CONSTRAINT "FK_482136e6e59c36b3b84dc22a47d"
        `);
    await queryRunner.query(`
            ALTER TABLE "checklist_items" DROP CONSTRAINT "FK_checklist_items_job_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "checklist_items" DROP CONSTRAINT "FK_846efd6f127cd58725fd25251a5"
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs" DROP CONSTRAINT "FK_jobs_assigned_tech_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs" DROP CONSTRAINT "FK_jobs_vehicle_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs" DROP CONSTRAINT "FK_jobs_customer_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "jobs" DROP CONSTRAINT "FK_6866bb3c271a60ec9156aa84569"
        `);
    await queryRunner.query(`
            ALTER TABLE "vehicles" DROP CONSTRAINT "FK_vehicles_customer_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "vehicles" DROP CONSTRAINT "FK_dd6ead0071e6f40d6878306d07e"
        `);
    await queryRunner.query(`
            ALTER TABLE "customers" DROP CONSTRAINT "FK_c04b1ab3076e753f96c64318286"
        `);
    await queryRunner.query(`
            ALTER TABLE "users" DROP COLUMN "customer_id"
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses" DROP COLUMN "next_invoice_number"
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses" DROP COLUMN "currency"
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses" DROP COLUMN "timezone"
        `);
    await queryRunner.query(`
            ALTER TABLE "businesses" DROP COLUMN "settings"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."timers_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."timers_job_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."timers_business_id_ends_at_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "timers"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."solvent_applications_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."solvent_applications_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "solvent_applications"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."signatures_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."signatures_job_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."signatures_quote_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "signatures"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."film_readings_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."film_readings_job_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."film_readings_panel_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "film_readings"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."quote_lines_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."quote_lines_quote_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "quote_lines"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."quotes_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."quotes_customer_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "quotes"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."stock_movements_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."stock_movements_product_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."stock_movements_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "stock_movements"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."products_sync_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "products"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."damage_pins_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."damage_pins_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "damage_pins"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."photos_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."photos_job_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."photos_vehicle_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "photos"
        `);
    await queryRunner.query(`
            DROP TABLE "blobs"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."payments_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."payments_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "payments"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."correction_passes_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."correction_passes_job_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."correction_passes_panel_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "correction_passes"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."job_panels_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."job_panels_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "job_panels"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."masking_items_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."masking_items_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "masking_items"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."invoices_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."invoices_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "invoices"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."climate_readings_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."climate_readings_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "climate_readings"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."chip_layers_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."chip_layers_chip_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."chip_layers_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "chip_layers"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."chips_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."chips_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "chips"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."checklist_items_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."checklist_items_job_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "checklist_items"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."jobs_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."jobs_business_id_window_start_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."jobs_assigned_tech_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."jobs_customer_id_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."jobs_vehicle_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "jobs"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."vehicles_sync_idx"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."vehicles_customer_id_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "vehicles"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."customers_sync_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "customers"
        `);
    await queryRunner.query(`
            DROP INDEX "public"."audit_entries_business_at_idx"
        `);
    await queryRunner.query(`
            DROP TABLE "audit_entries"
        `);
    await queryRunner.query(`DROP FUNCTION "panelpass_bump_version"()`);
    await queryRunner.query(`DROP SEQUENCE "sync_version"`);
  }
}
