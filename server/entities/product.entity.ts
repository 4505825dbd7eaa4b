import { Column, Entity, Index } from 'typeorm';
import { OptionalIntColumn, OptionalDayColumn, VarcharColumn, OptionalCountColumn, DecimalColumn } from './columns';
import { ArchivableEntity } from './base-entities';

/** A catalog product (a motherboard) with its power design and the features buyers compare. */
@Entity({ name: 'products' })
@Index('uq_products_maker_model', ['maker', 'model'], { unique: true })
export class ProductEntity extends ArchivableEntity {
  @VarcharColumn(80)
  maker: string;

  @VarcharColumn(120)
  model: string;

  @VarcharColumn(32)
  category: string;

  @VarcharColumn(80)
  platform: string;

  @VarcharColumn(40)
  socket: string;

  @VarcharColumn(40)
  chipset: string;

  @VarcharColumn(16, { name: 'form_factor' })
  formFactor: string;

  @OptionalDayColumn('release_date')
  releaseDate: string | null;

  @VarcharColumn(80, { name: 'vrm_controller', nullable: true })
  vrmController: string | null;

  @OptionalCountColumn('controller_phases')
  controllerPhases: number | null;

  @VarcharColumn(16, { name: 'phase_multiplication', nullable: true })
  phaseMultiplication: string | null;

  @OptionalCountColumn('stages_per_phase')
  stagesPerPhase: number | null;

  /** Derived from controller phases and multiplication by the service; stored so the catalog can sort on it. */
  @OptionalCountColumn('effective_phases')
  effectivePhases: number | null;

  @VarcharColumn(32, { name: 'vcore_stage_type', nullable: true })
  vcoreStageType: string | null;

  @VarcharColumn(80, { name: 'vcore_stage_part', nullable: true })
  vcoreStagePart: string | null;

  /** Amps, DECIMAL(5,1): arrives from the driver as a string. */
  @DecimalColumn(5, 1, 'vcore_stage_current_a', { nullable: true })
  vcoreStageCurrentA: string | null;

  @OptionalCountColumn('soc_rail_stages')
  socRailStages: number | null;

  @VarcharColumn(200, { name: 'other_rails', nullable: true })
  otherRails: string | null;

  @VarcharColumn(500, { name: 'heatsink_notes', nullable: true })
  heatsinkNotes: string | null;

  @OptionalCountColumn('rear_usb2')
  rearUsb2: number | null;

  @OptionalCountColumn('rear_usb_5g')
  rearUsb5g: number | null;

  @OptionalCountColumn('rear_usb_10g')
  rearUsb10g: number | null;

  @OptionalCountColumn('rear_usb_20g')
  rearUsb20g: number | null;

  @OptionalCountColumn('rear_usb_40g')
  rearUsb40g: number | null;

  @VarcharColumn(16, { name: 'front_usb_c_header', nullable: true })
  frontUsbCHeader: string | null;

  @OptionalIntColumn('lan_speed_mbps')
  lanSpeedMbps: number | null;

  @VarcharColumn(16, { name: 'wifi', nullable: true })
  wifi: string | null;

  @OptionalCountColumn('m2_slots')
  m2Slots: number | null;

  @OptionalCountColumn('sata_ports')
  sataPorts: number | null;

  @VarcharColumn(120, { nullable: true })
  audio: string | null;

  @Column({ type: 'boolean', name: 'io_shield_prefitted', nullable: true })
  ioShieldPrefitted: boolean | null;
}
