import { Column, Entity, Index } from 'typeorm';
import { ArchivableEntity } from './base-entities';

/** A catalog product (a motherboard) with its power design and the features buyers compare. */
@Entity({ name: 'products' })
@Index('uq_products_maker_model', ['maker', 'model'], { unique: true })
export class ProductEntity extends ArchivableEntity {
  @Column({ type: 'varchar', length: 80 })
  maker: string;

  @Column({ type: 'varchar', length: 120 })
  model: string;

  @Column({ type: 'varchar', length: 32 })
  category: string;

  @Column({ type: 'varchar', length: 80 })
  platform: string;

  @Column({ type: 'varchar', length: 40 })
  socket: string;

  @Column({ type: 'varchar', length: 40 })
  chipset: string;

  @Column({ type: 'varchar', length: 16, name: 'form_factor' })
  formFactor: string;

  @Column({ type: 'date', name: 'release_date', nullable: true, utc: true })
  releaseDate: string | null;

  @Column({ type: 'varchar', length: 80, name: 'vrm_controller', nullable: true })
  vrmController: string | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'controller_phases', nullable: true })
  controllerPhases: number | null;

  @Column({ type: 'varchar', length: 16, name: 'phase_multiplication', nullable: true })
  phaseMultiplication: string | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'stages_per_phase', nullable: true })
  stagesPerPhase: number | null;

  /** Derived from controller phases and multiplication by the service; stored so the catalog can sort on it. */
  @Column({ type: 'tinyint', unsigned: true, name: 'effective_phases', nullable: true })
  effectivePhases: number | null;

  @Column({ type: 'varchar', length: 32, name: 'vcore_stage_type', nullable: true })
  vcoreStageType: string | null;

  @Column({ type: 'varchar', length: 80, name: 'vcore_stage_part', nullable: true })
  vcoreStagePart: string | null;

  /** Amps, DECIMAL(5,1): arrives from the driver as a string. */
  @Column({ type: 'decimal', precision: 5, scale: 1, name: 'vcore_stage_current_a', nullable: true })
  vcoreStageCurrentA: string | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'soc_rail_stages', nullable: true })
  socRailStages: number | null;

  @Column({ type: 'varchar', length: 200, name: 'other_rails', nullable: true })
  otherRails: string | null;

  @Column({ type: 'varchar', length: 500, name: 'heatsink_notes', nullable: true })
  heatsinkNotes: string | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'rear_usb2', nullable: true })
  rearUsb2: number | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'rear_usb_5g', nullable: true })
  rearUsb5g: number | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'rear_usb_10g', nullable: true })
  rearUsb10g: number | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'rear_usb_20g', nullable: true })
  rearUsb20g: number | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'rear_usb_40g', nullable: true })
  rearUsb40g: number | null;

  @Column({ type: 'varchar', length: 16, name: 'front_usb_c_header', nullable: true })
  frontUsbCHeader: string | null;

  @Column({ type: 'int', unsigned: true, name: 'lan_speed_mbps', nullable: true })
  lanSpeedMbps: number | null;

  @Column({ type: 'varchar', length: 16, name: 'wifi', nullable: true })
  wifi: string | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'm2_slots', nullable: true })
  m2Slots: number | null;

  @Column({ type: 'tinyint', unsigned: true, name: 'sata_ports', nullable: true })
  sataPorts: number | null;

  @Column({ type: 'varchar', length: 120, nullable: true })
  audio: string | null;

  @Column({ type: 'boolean', name: 'io_shield_prefitted', nullable: true })
  ioShieldPrefitted: boolean | null;
}
