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
import { recordAction } from '../services/audit.service';
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

  const newRoundup = (
    title: string,
    state: RoundupState,
    band: [number, number],
    targetDays: number,
    createdDaysAgo: number,
    ids = configIds,
  ) =>
    createRoundup(manager, staff, {
      title,
      state,
      band,
      targetPublishDate: date(targetDays),
      benchProfileId,
      configIds: ids,
      createdDaysAgo,
      now,
    });
  /** Tested entries whose every cell is accepted; each sample kept (bought) or back with its maker (lent). */
  const addFinishedEntries = async (
    target: { id: number },
    columns: number[],
    days: { accepted: number; received: number; returnBy: number; returned: number; firmware: string },
    boards: [string, [string, number] | null, string][],
  ) => {
    for (const [position, [model, purchase, serialNumber]] of boards.entries()) {
      const entryId = await addEntry(manager, staff, target, product(model), position, 'tested', null);
      for (const configId of columns) {
        await addCell(manager, target, entryId, configId, 'accepted', staff.tester.id, date(days.accepted), null, now);
      }
      const retail = purchase !== null;
      await manager.getRepository(SampleEntity).insert({
        entryId,
        source: retail ? 'retail' : 'vendor-loan',
        orderReference: retail ? purchase[0] : null,
        costMinor: retail ? purchase[1] : null,
        costCurrency: retail ? 'EUR' : null,
        vendorContact: retail ? null : 'Press desk, by e-mail',
        returnBy: retail ? null : date(days.returnBy),
        receivedOn: date(days.received),
        returnedOn: retail ? null : date(days.returned),
        serialNumber,
        firmwareOnArrival: days.firmware,
        status: retail ? 'kept' : 'returned',
      });
    }
  };
  // Finished boards below: model, order reference and price in euro cents if bought (null: lent), serial number.

  // --- An earlier roundup, tested and accepted: its results are what reference entries show.
  const flagship = await newRoundup(
    'Helix-1700 flagship boards',
    'writing',
    [30000, 45000],
    12,
    70,
    configIds.slice(0, 2),
  );
  const flagshipDays = { accepted: -30, received: -60, returnBy: -20, returned: -22, firmware: '1.02' };
  await addFinishedEntries(flagship, configIds.slice(0, 2), flagshipDays, [
    ['KV Stratum X90', ['KC-2025-31170', 39990], 'FX-4410-7731'],
    ['Fenwright X90', null, 'FX-4411-7731'],
    ['Lanthorn X90', null, 'FX-4412-7731'],
  ]);

  // --- A roundup readers can already read: published (Live), every cell accepted, so the reader site has a demo.
  const published = await newRoundup('Helix-1700 boards under €150', 'live', [9000, 15000], -20, 40);
  // The editor allows the raw logger files in this roundup's open data.
  await manager.getRepository(RoundupEntity).update({ id: published.id }, { openDataRawFiles: true });
  const publishedDays = { accepted: -26, received: -38, returnBy: -10, returned: -12, firmware: '1.03' };
  await addFinishedEntries(published, configIds, publishedDays, [
    ['KV Ridgeline B50', ['KC-2025-20118', 12990], 'HB5-7310-0042'],
    ['Holloway B50', null, 'HB5-7311-0042'],
    ['Cinderline B50', ['KC-2025-22118', 13990], 'HB5-7312-0042'],
    ['Wend B50', null, 'HB5-7313-0042'],
  ]);

  // --- The roundup on the bench now.
  const roundup = await newRoundup('Helix-1700 boards from €150 to €220', 'on-the-bench', [15000, 22000], 28, 24);
  const jules = staff.tester.id;
  const priya = staff.secondTester.id;
  // The matrix, one line a cell: board, state, tester, due date (days from today); each board's cells in the
  // order of the load configurations, the boards in entry order.
  const cells: [string, CellState, number | null, number | null][] = [
    ['KV Ridgeline B70', 'accepted', jules, -6],
    ['KV Ridgeline B70', 'accepted', jules, -5],
    ['KV Ridgeline B70', 'accepted', jules, -4],
    ['Holloway B70 Plus', 'accepted', jules, -2],
    ['Holloway B70 Plus', 'recorded', jules, -1],
    ['Holloway B70 Plus', 'running', jules, 1],
    ['Cinderline B70', 'recorded', priya, 0],
    ['Cinderline B70', 'assigned', priya, -1],
    ['Cinderline B70', 'assigned', priya, 3],
    ['Q-Marlpit B70', 'needs-retest', priya, 2],
    ['Q-Marlpit B70', 'assigned', priya, 4],
    ['Q-Marlpit B70', 'assigned', priya, 4],
    ['Wend B70', 'assigned', jules, 6],
    ['Wend B70', 'assigned', jules, 7],
    ['Wend B70', 'assigned', jules, 7],
    ['Halden B70', 'not-started', null, null],
    ['Halden B70', 'not-started', null, null],
    ['Halden B70', 'not-started', null, null],
    ['Holloway B50 Mini', 'not-started', null, null],
    ['Holloway B50 Mini', 'not-started', null, null],
    ['Holloway B50 Mini', 'not-started', null, null],
  ];
  const retestNotes: Record<string, string> = {
    'Q-Marlpit B70': 'Room drifted to 23.4 °C during the soak; run it again with the door shut.',
  };
  const models = [...new Set(cells.map(([model]) => model))];
  const cellIds = new Map<string, number>();
  for (const [position, model] of models.entries()) {
    const entryId = await addEntry(manager, staff, roundup, product(model), position, 'tested', null);
    const boardCells = cells.filter(([m]) => m === model);
    for (const [column, [, state, testerId, due]] of boardCells.entries()) {
      const note = state === 'needs-retest' ? (retestNotes[model] ?? null) : null;
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
      cellIds.set(`${model}:${column}`, id);
    }
    await manager.getRepository(SampleEntity).insert({ entryId, ...sampleFor(model, date) });
  }
  // The reference entry: last roundup's pick, shown in the charts, not tested again.
  await addEntry(manager, staff, roundup, product('KV Stratum X90'), models.length, 'reference', flagship.id);

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
  const audits: [string, Record<string, unknown>][] = [
    ['roundup.created', { title: seed.title, platform: DEMO_PLATFORM, loadConfigurationIds: seed.configIds }],
    ['roundup.state_changed', { from: 'planning', to: 'on-the-bench' }],
  ];
  if (seed.state === 'writing') audits.push(['roundup.state_changed', { from: 'on-the-bench', to: 'writing' }]);
  for (const [action, details] of audits) {
    await recordAction(manager, staff.editor, action, ['roundup', id], details);
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
  await recordAction(manager, staff.editor, 'roundup.entry_added', ['roundup', roundup.id], {
    entryId,
    productId,
    kind,
    referenceRoundupId,
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

/**
 * Where each board of the current roundup came from: bought (order reference, price in euro cents) or lent
 * (vendor contact, return-by date in days from today). One loan is four days past its return-by date.
 */
const sampleOrigins: Record<string, ['retail', string, number] | ['vendor-loan', string, number]> = {
  'KV Ridgeline B70': ['retail', 'KC-2025-44817', 18990],
  'Holloway B70 Plus': ['vendor-loan', 'Edda Vantongeren, press desk, Ostrel Works', -4],
  'Cinderline B70': ['vendor-loan', 'Marit Oyelaran, Brightmoor review programme', 21],
  'Q-Marlpit B70': ['retail', 'PL-118-20934', 17990],
  'Wend B70': ['vendor-loan', 'Tobin Achterberg, Tarnwell press office', 35],
  'Halden B70': ['vendor-loan', 'Vesk sample desk', 50],
  'Holloway B50 Mini': ['retail', 'FH-77310', 16990],
};

/** Boards already in the lab: received (days from today), serial number, firmware on arrival, state; the rest are ordered. */
const sampleArrivals: Record<string, [number, string, string, SampleEntity['status']]> = {
  'KV Ridgeline B70': [-18, 'KV7R-0B2211', 'F04', 'tested'],
  'Holloway B70 Plus': [-30, 'OW-4411-0097', '0812', 'on-the-bench'],
  'Cinderline B70': [-14, 'BM-C70-55102', '1.10', 'on-the-bench'],
  'Q-Marlpit B70': [-12, 'QM70-88-2025', 'A07', 'on-the-bench'],
  'Wend B70': [-5, 'TW-WB70-3019', '2.0.1', 'received'],
};

const sampleConditions: Record<string, string> = {
  'KV Ridgeline B70': 'Sealed retail box',
  'Holloway B70 Plus': 'Press sample; box dented at one corner, board fine',
  'Cinderline B70': 'Shipped without the Wi-Fi antenna; asked for one',
  'Q-Marlpit B70': 'Open-box purchase, all accessories present',
  'Wend B70': 'New, sealed',
};

function sampleFor(model: string, date: (days: number) => string): Partial<SampleEntity> {
  const [source, party, figure] = sampleOrigins[model];
  const origin: Partial<SampleEntity> =
    source === 'retail'
      ? { source, orderReference: party, costMinor: figure, costCurrency: 'EUR' }
      : { source, vendorContact: party, returnBy: date(figure) };
  const arrival = sampleArrivals[model];
  if (!arrival) return { ...origin, status: 'ordered' };
  const [receivedDays, serialNumber, firmwareOnArrival, status] = arrival;
  return {
    ...origin,
    receivedOn: date(receivedDays),
    serialNumber,
    firmwareOnArrival,
    conditionNotes: sampleConditions[model],
    status,
  };
}
