import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateProducts1765100001000 implements MigrationInterface {
  name = 'CreateProducts1765100001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE products (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        maker VARCHAR(80) NOT NULL,
        model VARCHAR(120) NOT NULL,
        category VARCHAR(32) NOT NULL,
        platform VARCHAR(80) NOT NULL,
        socket VARCHAR(40) NOT NULL,
        chipset VARCHAR(40) NOT NULL,
        form_factor VARCHAR(16) NOT NULL,
        release_date DATE NULL,
        vrm_controller VARCHAR(80) NULL,
        controller_phases TINYINT UNSIGNED NULL,
        phase_multiplication VARCHAR(16) NULL,
        stages_per_phase TINYINT UNSIGNED NULL,
        effective_phases TINYINT UNSIGNED NULL,
        vcore_stage_type VARCHAR(32) NULL,
        vcore_stage_part VARCHAR(80) NULL,
        vcore_stage_current_a DECIMAL(5,1) NULL COMMENT 'continuous rating of one V-core stage, A',
        soc_rail_stages TINYINT UNSIGNED NULL,
        other_rails VARCHAR(200) NULL,
        heatsink_notes VARCHAR(500) NULL,
        rear_usb2 TINYINT UNSIGNED NULL,
        rear_usb_5g TINYINT UNSIGNED NULL,
        rear_usb_10g TINYINT UNSIGNED NULL,
        rear_usb_20g TINYINT UNSIGNED NULL,
        rear_usb_40g TINYINT UNSIGNED NULL,
        front_usb_c_header VARCHAR(16) NULL,
        lan_speed_mbps INT UNSIGNED NULL,
        wifi VARCHAR(16) NULL,
        m2_slots TINYINT UNSIGNED NULL,
        sata_ports TINYINT UNSIGNED NULL,
        audio VARCHAR(120) NULL,
        io_shield_prefitted TINYINT(1) NULL,
        archived_at DATETIME(3) NULL,
        created_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_products_maker_model (maker, model),
        KEY ix_products_platform (platform, chipset),
        CONSTRAINT fk_products_created_by FOREIGN KEY (created_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE products');
  }
}
