import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateProductPrices1765100002000 implements MigrationInterface {
  name = 'CreateProductPrices1765100002000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE product_prices (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        product_id INT UNSIGNED NOT NULL,
        region VARCHAR(8) NOT NULL,
        currency CHAR(3) NOT NULL,
        amount_minor INT UNSIGNED NOT NULL COMMENT 'integer minor units of currency',
        observed_on DATE NOT NULL,
        source VARCHAR(200) NOT NULL,
        recorded_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_product_prices_latest (product_id, region, observed_on, id),
        CONSTRAINT fk_product_prices_product FOREIGN KEY (product_id) REFERENCES products (id) ON DELETE CASCADE,
        CONSTRAINT fk_product_prices_recorded_by FOREIGN KEY (recorded_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE product_prices');
  }
}
