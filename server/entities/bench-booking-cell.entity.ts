import { Entity, PrimaryColumn } from 'typeorm';

/** Which assigned matrix cells a booking is for. */
@Entity({ name: 'bench_booking_cells' })
export class BenchBookingCellEntity {
  @PrimaryColumn({ type: 'int', unsigned: true, name: 'booking_id' })
  bookingId: number;

  @PrimaryColumn({ type: 'int', unsigned: true, name: 'matrix_cell_id' })
  cellId: number;
}
