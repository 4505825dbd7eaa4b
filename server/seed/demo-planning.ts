import type { EntityManager } from 'typeorm';
import { BenchBookingCellEntity } from '../entities/bench-booking-cell.entity';
import { BenchBookingEntity } from '../entities/bench-booking.entity';
import { BenchProfileEntity } from '../entities/bench-profile.entity';
import { BenchEntity } from '../entities/bench.entity';
import { LoadConfigurationEntity } from '../entities/load-configuration.entity';
import { MatrixCellEntity } from '../entities/matrix-cell.entity';
import { ProductPriceEntity } from '../entities/product-price.entity';
import { ProductEntity } from '../entities/product.entity';
import { RoundupEntryEntity } from '../entities/roundup-entry.entity';
import { RoundupLoadConfigurationEntity } from '../entities/roundup-load-configuration.entity';
import { RoundupEntity } from '../entities/roundup.entity';
import { SampleEntity } from '../entities/sample.entity';
import type { UserEntity } from '../entities/user.entity';
import { recordAudit } from '../services/audit.service';
import { productColumnsFromInput } from '../mappers/product-fields';
import { calendarDateIn } from '../../shared/domain/planning/loan-overdue';
import type { CellState } from '../../shared/domain/planning/matrix-cell-states';
import type { RoundupState } from '../../shared/domain/planning/roundup-states';
import { DEMO_PLATFORM, demoBoards, demoShops } from './demo-catalog';

export interface PlanningStaff {
  editor: UserEntity;
  tester: UserEntity;
  secondTester: UserEntity;
}

const OUTLET_ZONE = 'Europe/Berlin';
const DAY_MS = 86_400_000;

/**
 * The invented outlet's planning data: a Helix-1700 catalog with price history, a reusable bench profile and
 * three load configurations, an earlier roundup whose results are done (the source of a reference entry), and
 * one roundup on the bench with samples, a part-filled matrix and two booked benches. Dates are relative to
 * the moment of seeding, so the demo always looks current (one vendor loan is always four days overdue).
 */
export async function seedPlanning(manager: EntityManager, staff: PlanningStaff, now = new Date()) {
  const today = calendarDateIn(OUTLET_ZONE, now);
  const date = (days: number) => new Date(Date.parse(`${today}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
  const at = (days: number, hourUtc: number) => new Date(Date.parse(`${date(days)}T00:00:00Z`) + hourUtc * 3_600_000);

  // --- Catalog
  const productIds = new Map<string, number>();
  for (const [index, board] of demoBoards.entries()) {
    const { identifiers } = await manager
      .getRepository(ProductEntity)
      .insert({ ...productColumnsFromInput(board.product), createdBy: staff.editor.id });
    const id = Number(identifiers[0].id);
    productIds.set(board.product.model, id);
    const prices = board.pricesDe.map((p, n) => ({
      productId: id,
      region: 'DE',
      currency: 'EUR',
      amountMinor: p.amountMinor,
      observedOn: date(-p.daysAgo),
      source: demoShops[(index + n) % demoShops.length],
      recordedBy: staff.tester.id,
    }));
    if (board.priceGb) {
      prices.push({
        productId: id,
        region: 'GB',
        currency: 'GBP',
        amountMinor: board.priceGb.amountMinor,
        observedOn: date(-board.priceGb.daysAgo),
        source: 'Harrowgate PC Supply',
        recordedBy: staff.tester.id,
      });
    }
    await manager.getRepository(ProductPriceEntity).insert(prices);
  }
  const product = (model: string) => {
    const id = productIds.get(model);
    if (!id) throw new Error(`Demo seed: no board ${model}`);
    return id;
  };

  // --- Test plan building blocks
  const { identifiers: profileIds } = await manager.getRepository(BenchProfileEntity).insert({
    name: 'Open bench, 21 °C room',
    caseAndFans: 'Open test bench; one 120 mm fan at 800 rpm, 30 cm from the board, aimed at the V-core heatsink',
    cooler: 'Frostvane 360 mm liquid cooler, pump at full speed, radiator fans at 1200 rpm',
    psu: 'Ampwell 1000 W, 80 Plus Platinum',
    memory: '2 × 16 GB at 6000 MT/s, timings 30-38-38-96, 1.35 V',
    roomTempTargetC: '21.0',
    roomTempToleranceC: '1.0',
    probeType: 'Type K thermocouple, 0.1 mm bead, logged at 1 Hz',
    probePlacement:
      'Board rear, directly under the hottest V-core stage, held with polyimide tape; ambient probe 20 cm beside the bench',
    requiredSoakMinutes: 60,
    notes: 'Room door closed during runs; the window blind stays down on Bench A.',
    createdBy: staff.editor.id,
  });
  const benchProfileId = Number(profileIds[0].id);
  const configs = [
    {
      name: 'HX-16 stock, all-core load',
      cpuDescription: 'Helix HX-16 retail sample, 16 cores',
      settingsMode: 'stock',
      fixedClockMhz: null,
      settingsNotes: 'Platform default power limits; all-core vector load',
      expectedPackagePowerW: '232.0',
      coreVoltageV: '1.280',
      soakMinutes: 60,
    },
    {
      name: 'HX-16 fixed 5.0 GHz at 1.30 V',
      cpuDescription: 'Helix HX-16 retail sample, 16 cores',
      settingsMode: 'fixed',
      fixedClockMhz: 5000,
      settingsNotes: 'Load-line calibration at the middle level; same all-core vector load',
      expectedPackagePowerW: '268.5',
      coreVoltageV: '1.300',
      soakMinutes: 60,
    },
    {
      name: 'HX-16 fixed 5.2 GHz at 1.36 V (stress)',
      cpuDescription: 'Helix HX-16 retail sample, 16 cores',
      settingsMode: 'fixed',
      fixedClockMhz: 5200,
      settingsNotes: 'The worst case we ask of a board in this class; stop at the first throttle',
      expectedPackagePowerW: '312.0',
      coreVoltageV: '1.360',
      soakMinutes: 60,
    },
  ];
  const configIds: number[] = [];
  for (const config of configs) {
    const { identifiers } = await manager
      .getRepository(LoadConfigurationEntity)
      .insert({ ...config, createdBy: staff.editor.id });
    configIds.push(Number(identifiers[0].id));
  }

  // --- An earlier roundup, tested and accepted: its results are what reference entries show.
  const flagship = await createRoundup(manager, staff, {
    title: 'Helix-1700 flagship boards',
    state: 'writing',
    band: [30000, 45000],
    targetPublishDate: date(12),
    benchProfileId,
    configIds: configIds.slice(0, 2),
    createdDaysAgo: 70,
    now,
  });
  for (const [position, model] of ['KV Stratum X90', 'Fenwright X90', 'Lanthorn X90'].entries()) {
    const entryId = await addEntry(manager, staff, flagship, product(model), position, 'tested', null);
    for (const configId of configIds.slice(0, 2)) {
      await addCell(manager, flagship, entryId, configId, 'accepted', staff.tester.id, date(-30), null, now);
    }
    await manager.getRepository(SampleEntity).insert({
      entryId,
      source: position === 0 ? 'retail' : 'vendor-loan',
      orderReference: position === 0 ? 'KC-2025-31170' : null,
      costMinor: position === 0 ? 39990 : null,
      costCurrency: position === 0 ? 'EUR' : null,
      vendorContact: position === 0 ? null : 'Press desk, by e-mail',
      returnBy: position === 0 ? null : date(-20),
      receivedOn: date(-60),
      returnedOn: position === 0 ? null : date(-22),
      serialNumber: `FX-${4410 + position}-7731`,
      firmwareOnArrival: '1.02',
      status: position === 0 ? 'kept' : 'returned',
    });
  }

  // --- A roundup readers can already read: published (Live), every cell accepted, so the reader site has a demo.
  const published = await createRoundup(manager, staff, {
    title: 'Helix-1700 boards under €150',
    state: 'live',
    band: [9000, 15000],
    targetPublishDate: date(-20),
    benchProfileId,
    configIds,
    createdDaysAgo: 40,
    now,
  });
  // The editor allows the raw logger files in this roundup's open data.
  await manager.getRepository(RoundupEntity).update({ id: published.id }, { openDataRawFiles: true });
  for (const [position, model] of ['KV Ridgeline B50', 'Holloway B50', 'Cinderline B50', 'Wend B50'].entries()) {
    const entryId = await addEntry(manager, staff, published, product(model), position, 'tested', null);
    for (const configId of configIds) {
      await addCell(manager, published, entryId, configId, 'accepted', staff.tester.id, date(-26), null, now);
    }
    const retail = position % 2 === 0;
    await manager.getRepository(SampleEntity).insert({
      entryId,
      source: retail ? 'retail' : 'vendor-loan',
      orderReference: retail ? `KC-2025-2${position}118` : null,
      costMinor: retail ? 12990 + position * 500 : null,
      costCurrency: retail ? 'EUR' : null,
      vendorContact: retail ? null : 'Press desk, by e-mail',
      returnBy: retail ? null : date(-10),
      receivedOn: date(-38),
      returnedOn: retail ? null : date(-12),
      serialNumber: `HB5-${7310 + position}-0042`,
      firmwareOnArrival: '1.03',
      status: retail ? 'kept' : 'returned',
    });
  }

  // --- The roundup on the bench now.
  const roundup = await createRoundup(manager, staff, {
    title: 'Helix-1700 boards from €150 to €220',
    state: 'on-the-bench',
    band: [15000, 22000],
    targetPublishDate: date(28),
    benchProfileId,
    configIds,
    createdDaysAgo: 24,
    now,
  });
  const jules = staff.tester.id;
  const priya = staff.secondTester.id;
  type Row = { model: string; cells: [CellState, number | null, number | null][]; note?: string };
  // Per configuration: state, tester, due date (days from today).
  const rows: Row[] = [
    {
      model: 'KV Ridgeline B70',
      cells: [
        ['accepted', jules, -6],
        ['accepted', jules, -5],
        ['accepted', jules, -4],
      ],
    },
    {
      model: 'Holloway B70 Plus',
      cells: [
        ['accepted', jules, -2],
        ['recorded', jules, -1],
        ['running', jules, 1],
      ],
    },
    {
      model: 'Cinderline B70',
      cells: [
        ['recorded', priya, 0],
        ['assigned', priya, -1],
        ['assigned', priya, 3],
      ],
    },
    {
      model: 'Q-Marlpit B70',
      cells: [
        ['needs-retest', priya, 2],
        ['assigned', priya, 4],
        ['assigned', priya, 4],
      ],
      note: 'Room drifted to 23.4 °C during the soak; run it again with the door shut.',
    },
    {
      model: 'Wend B70',
      cells: [
        ['assigned', jules, 6],
        ['assigned', jules, 7],
        ['assigned', jules, 7],
      ],
    },
    {
      model: 'Halden B70',
      cells: [
        ['not-started', null, null],
        ['not-started', null, null],
        ['not-started', null, null],
      ],
    },
    {
      model: 'Holloway B50 Mini',
      cells: [
        ['not-started', null, null],
        ['not-started', null, null],
        ['not-started', null, null],
      ],
    },
  ];
  const cellIds = new Map<string, number>();
  for (const [position, row] of rows.entries()) {
    const entryId = await addEntry(manager, staff, roundup, product(row.model), position, 'tested', null);
    for (const [column, [state, testerId, due]] of row.cells.entries()) {
      const note = state === 'needs-retest' ? (row.note ?? null) : null;
      const id = await addCell(
        manager,
        roundup,
        entryId,
        configIds[column],
        state,
        testerId,
        due == null ? null : date(due),
        note,
        now,
      );
      cellIds.set(`${row.model}:${column}`, id);
    }
    await manager.getRepository(SampleEntity).insert({ entryId, ...sampleFor(row.model, date) });
  }
  // The reference entry: last roundup's pick, shown in the charts, not tested again.
  await addEntry(manager, staff, roundup, product('KV Stratum X90'), rows.length, 'reference', flagship.id);

  // --- Benches and their calendars.
  const benchIds: number[] = [];
  for (const bench of [
    { name: 'Bench A', location: 'Lab, window side', notes: 'Blind down for every run.' },
    { name: 'Bench B', location: 'Lab, back room', notes: 'Quietest spot; the door must stay shut.' },
  ]) {
    const { identifiers } = await manager.getRepository(BenchEntity).insert({ ...bench, benchProfileId, active: true });
    benchIds.push(Number(identifiers[0].id));
  }
  const hourNow = new Date(Math.floor(now.getTime() / 3_600_000) * 3_600_000);
  const bookings: { bench: number; tester: number; startsAt: Date; endsAt: Date; cells: string[]; note: string }[] = [
    {
      bench: benchIds[0],
      tester: jules,
      startsAt: new Date(hourNow.getTime() - 3_600_000),
      endsAt: new Date(hourNow.getTime() + 3 * 3_600_000),
      cells: ['Holloway B70 Plus:2'],
      note: 'Stress configuration soak',
    },
    {
      bench: benchIds[0],
      tester: jules,
      startsAt: at(2, 7),
      endsAt: at(2, 12),
      cells: ['Wend B70:0', 'Wend B70:1'],
      note: 'Two soaks back to back',
    },
    {
      bench: benchIds[1],
      tester: priya,
      startsAt: at(1, 7),
      endsAt: at(1, 11),
      cells: ['Cinderline B70:1', 'Cinderline B70:2'],
      note: '',
    },
    {
      bench: benchIds[1],
      tester: priya,
      startsAt: at(2, 8),
      endsAt: at(2, 10),
      cells: ['Q-Marlpit B70:0'],
      note: 'Retest with the door shut',
    },
  ];
  for (const booking of bookings) {
    const { identifiers } = await manager.getRepository(BenchBookingEntity).insert({
      benchId: booking.bench,
      testerId: booking.tester,
      startsAt: booking.startsAt,
      endsAt: booking.endsAt,
      note: booking.note || null,
    });
    const bookingId = Number(identifiers[0].id);
    await manager
      .getRepository(BenchBookingCellEntity)
      .insert(booking.cells.map((key) => ({ bookingId, cellId: cellIds.get(key) as number })));
  }
  return { roundupId: roundup.id, earlierRoundupId: flagship.id, productCount: demoBoards.length };
}

interface RoundupSeed {
  title: string;
  state: RoundupState;
  band: [number, number];
  targetPublishDate: string;
  benchProfileId: number;
  configIds: number[];
  createdDaysAgo: number;
  now: Date;
}

async function createRoundup(manager: EntityManager, staff: PlanningStaff, seed: RoundupSeed) {
  const { identifiers } = await manager.getRepository(RoundupEntity).insert({
    title: seed.title,
    category: 'motherboard',
    platform: DEMO_PLATFORM,
    state: seed.state,
    priceMinMinor: seed.band[0],
    priceMaxMinor: seed.band[1],
    currency: 'EUR',
    region: 'DE',
    targetPublishDate: seed.targetPublishDate,
    timeZone: OUTLET_ZONE,
    benchProfileId: seed.benchProfileId,
    createdBy: staff.editor.id,
    stateChangedAt: new Date(seed.now.getTime() - Math.floor(seed.createdDaysAgo / 2) * DAY_MS),
  });
  const id = Number(identifiers[0].id);
  await manager
    .getRepository(RoundupLoadConfigurationEntity)
    .insert(seed.configIds.map((loadConfigurationId, position) => ({ roundupId: id, loadConfigurationId, position })));
  await recordAudit(manager, {
    actorId: staff.editor.id,
    action: 'roundup.created',
    subjectType: 'roundup',
    subjectId: id,
    details: { title: seed.title, platform: DEMO_PLATFORM, loadConfigurationIds: seed.configIds },
  });
  await recordAudit(manager, {
    actorId: staff.editor.id,
    action: 'roundup.state_changed',
    subjectType: 'roundup',
    subjectId: id,
    details: { from: 'planning', to: 'on-the-bench' },
  });
  if (seed.state === 'writing') {
    await recordAudit(manager, {
      actorId: staff.editor.id,
      action: 'roundup.state_changed',
      subjectType: 'roundup',
      subjectId: id,
      details: { from: 'on-the-bench', to: 'writing' },
    });
  }
  return { id, timeZone: OUTLET_ZONE };
}

async function addEntry(
  manager: EntityManager,
  staff: PlanningStaff,
  roundup: { id: number },
  productId: number,
  position: number,
  kind: 'tested' | 'reference',
  referenceRoundupId: number | null,
) {
  const { identifiers } = await manager
    .getRepository(RoundupEntryEntity)
    .insert({ roundupId: roundup.id, productId, kind, referenceRoundupId, position, addedBy: staff.editor.id });
  const entryId = Number(identifiers[0].id);
  await recordAudit(manager, {
    actorId: staff.editor.id,
    action: 'roundup.entry_added',
    subjectType: 'roundup',
    subjectId: roundup.id,
    details: { entryId, productId, kind, referenceRoundupId },
  });
  return entryId;
}

async function addCell(
  manager: EntityManager,
  roundup: { id: number },
  entryId: number,
  loadConfigurationId: number,
  state: CellState,
  testerId: number | null,
  dueDate: string | null,
  note: string | null,
  now: Date,
) {
  const { identifiers } = await manager.getRepository(MatrixCellEntity).insert({
    roundupId: roundup.id,
    entryId,
    loadConfigurationId,
    state,
    testerId,
    dueDate,
    note,
    assignedAt: testerId ? new Date(now.getTime() - 10 * DAY_MS) : null,
    stateChangedAt: new Date(now.getTime() - DAY_MS),
  });
  return Number(identifiers[0].id);
}

/** Where each board of the current roundup came from; one loan is four days past its return-by date. */
function sampleFor(model: string, date: (days: number) => string): Partial<SampleEntity> {
  switch (model) {
    case 'KV Ridgeline B70':
      return {
        source: 'retail',
        orderReference: 'KC-2025-44817',
        costMinor: 18990,
        costCurrency: 'EUR',
        receivedOn: date(-18),
        serialNumber: 'KV7R-0B2211',
        firmwareOnArrival: 'F04',
        conditionNotes: 'Sealed retail box',
        status: 'tested',
      };
    case 'Holloway B70 Plus':
      return {
        source: 'vendor-loan',
        vendorContact: 'Edda Vantongeren, press desk, Ostrel Works',
        returnBy: date(-4),
        receivedOn: date(-30),
        serialNumber: 'OW-4411-0097',
        firmwareOnArrival: '0812',
        conditionNotes: 'Press sample; box dented at one corner, board fine',
        status: 'on-the-bench',
      };
    case 'Cinderline B70':
      return {
        source: 'vendor-loan',
        vendorContact: 'Marit Oyelaran, Brightmoor review programme',
        returnBy: date(21),
        receivedOn: date(-14),
        serialNumber: 'BM-C70-55102',
        firmwareOnArrival: '1.10',
        conditionNotes: 'Shipped without the Wi-Fi antenna; asked for one',
        status: 'on-the-bench',
      };
    case 'Q-Marlpit B70':
      return {
        source: 'retail',
        orderReference: 'PL-118-20934',
        costMinor: 17990,
        costCurrency: 'EUR',
        receivedOn: date(-12),
        serialNumber: 'QM70-88-2025',
        firmwareOnArrival: 'A07',
        conditionNotes: 'Open-box purchase, all accessories present',
        status: 'on-the-bench',
      };
    case 'Wend B70':
      return {
        source: 'vendor-loan',
        vendorContact: 'Tobin Achterberg, Tarnwell press office',
        returnBy: date(35),
        receivedOn: date(-5),
        serialNumber: 'TW-WB70-3019',
        firmwareOnArrival: '2.0.1',
        conditionNotes: 'New, sealed',
        status: 'received',
      };
    case 'Halden B70':
      return { source: 'vendor-loan', vendorContact: 'Vesk sample desk', returnBy: date(50), status: 'ordered' };
    default:
      return { source: 'retail', orderReference: 'FH-77310', costMinor: 16990, costCurrency: 'EUR', status: 'ordered' };
  }
}
