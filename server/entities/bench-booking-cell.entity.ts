import { Entity } from 'typeorm';
import { KeyedByPair } from './base-entities';

/** Which assigned matrix cells a booking is for. */
@Entity({ name: 'bench_booking_cells' })
export class BenchBookingCellEntity extends KeyedByPair(['bookingId', 'booking_id'], ['cellId', 'matrix_cell_id']) {}
