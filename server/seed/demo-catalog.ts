import type { ProductInput } from '../../shared/schemas/catalog';

// The invented demo catalog: Helix-1700 boards (socket HX4) from invented makers, on three invented chipsets
// (HX-B50 entry, HX-B70 mid-range, HX-X90 high end). Every name, part label and price here is made up.
// One table a side of the board, keyed by model; demoBoards below puts each board together.

export const DEMO_PLATFORM = 'Helix-1700';
const SOCKET = 'HX4';

type Power = ProductInput['powerDesign'];
type Features = ProductInput['features'];
type Stage = 'ips' | 'discrete';

/** maker, model, chipset, form factor, release date — in the order the demo catalog is seeded */
const boards: [string, string, 'HX-B50' | 'HX-B70' | 'HX-X90', ProductInput['formFactor'], string][] = [
  ['Korvath', 'KV Ridgeline B50', 'HX-B50', 'atx', '2025-02-04'],
  ['Korvath', 'KV Ridgeline B50M', 'HX-B50', 'micro-atx', '2025-02-04'],
  ['Korvath', 'KV Ridgeline B70', 'HX-B70', 'atx', '2025-03-11'],
  ['Korvath', 'KV Stratum X90', 'HX-X90', 'atx', '2025-01-21'],
  ['Korvath', 'KV Stratum X90 Thermal', 'HX-X90', 'e-atx', '2025-04-15'],
  ['Ostrel Works', 'Holloway B50', 'HX-B50', 'atx', '2025-02-18'],
  ['Ostrel Works', 'Holloway B50 Mini', 'HX-B50', 'mini-itx', '2025-03-25'],
  ['Ostrel Works', 'Holloway B70 Plus', 'HX-B70', 'atx', '2025-03-04'],
  ['Ostrel Works', 'Fenwright X90', 'HX-X90', 'atx', '2025-01-28'],
  ['Brightmoor', 'Cinderline B50', 'HX-B50', 'atx', '2025-02-25'],
  ['Brightmoor', 'Cinderline B50M', 'HX-B50', 'micro-atx', '2025-02-25'],
  ['Brightmoor', 'Cinderline B70', 'HX-B70', 'atx', '2025-03-18'],
  ['Brightmoor', 'Lanthorn X90', 'HX-X90', 'atx', '2025-01-14'],
  ['Brightmoor', 'Lanthorn X90 Duo', 'HX-X90', 'e-atx', '2025-04-29'],
  ['Quillon', 'Q-Marlpit B50', 'HX-B50', 'atx', '2025-03-06'],
  ['Quillon', 'Q-Marlpit B70', 'HX-B70', 'atx', '2025-03-06'],
  ['Quillon', 'Q-Marlpit B70M', 'HX-B70', 'micro-atx', '2025-04-08'],
  ['Quillon', 'Q-Tessellate X90', 'HX-X90', 'atx', '2025-02-11'],
  ['Tarnwell', 'Wend B50', 'HX-B50', 'micro-atx', '2025-03-31'],
  ['Tarnwell', 'Wend B70', 'HX-B70', 'atx', '2025-04-22'],
  ['Tarnwell', 'Orrin X90', 'HX-X90', 'atx', '2025-03-12'],
  ['Vesk', 'Halden B70', 'HX-B70', 'atx', '2025-05-06'],
  ['Vesk', 'Halden B50 ITX', 'HX-B50', 'mini-itx', '2025-05-13'],
  ['Korvath', 'KV Ridgeline B70 Lite', 'HX-B70', 'micro-atx', '2025-05-20'],
];

/** V-core: controller label, controller phases, multiplication, stages per phase, stage type, part label, rating in A */
const vcore: Record<string, [string, number, Power['phaseMultiplication'], number, Stage, string, number]> = {
  'KV Ridgeline B50': ['KV-PWM6', 6, 'direct', 1, 'discrete', 'HS KN-30 / LS KN-12', 40],
  'KV Ridgeline B50M': ['KV-PWM6', 6, 'direct', 1, 'discrete', 'HS KN-30 / LS KN-12', 40],
  'KV Ridgeline B70': ['KV-PWM8', 8, 'doubled', 1, 'ips', 'KVS-50', 50],
  'KV Stratum X90': ['KV-PWM12', 12, 'teamed', 2, 'ips', 'KVS-90', 90],
  'KV Stratum X90 Thermal': ['KV-PWM12', 12, 'teamed', 2, 'ips', 'KVS-105', 105],
  'Holloway B50': ['OW-6210', 8, 'direct', 1, 'discrete', 'HS OW-N30 / LS OW-N10', 45],
  'Holloway B50 Mini': ['OW-6210', 6, 'direct', 1, 'ips', 'OWP-55', 55],
  'Holloway B70 Plus': ['OW-6212', 7, 'doubled', 1, 'ips', 'OWP-60', 60],
  'Fenwright X90': ['OW-8616', 16, 'direct', 1, 'ips', 'OWP-80', 80],
  'Cinderline B50': ['BM-PX6', 6, 'direct', 1, 'discrete', 'HS BX-25 / LS BX-08', 35],
  'Cinderline B50M': ['BM-PX6', 6, 'direct', 1, 'discrete', 'HS BX-25 / LS BX-08', 35],
  'Cinderline B70': ['BM-PX8', 8, 'doubled', 1, 'ips', 'BMS-60', 60],
  'Lanthorn X90': ['BM-PX10', 10, 'teamed', 2, 'ips', 'BMS-80', 80],
  'Lanthorn X90 Duo': ['BM-PX12', 12, 'teamed', 2, 'ips', 'BMS-105', 105],
  'Q-Marlpit B50': ['QN-V8', 8, 'direct', 1, 'discrete', 'HS QF-40 / LS QF-15', 50],
  'Q-Marlpit B70': ['QN-V12', 12, 'direct', 1, 'ips', 'QNS-55', 55],
  'Q-Marlpit B70M': ['QN-V8', 8, 'doubled', 1, 'ips', 'QNS-50', 50],
  'Q-Tessellate X90': ['QN-V14', 14, 'direct', 1, 'ips', 'QNS-90', 90],
  'Wend B50': ['TW-A6', 6, 'direct', 1, 'discrete', 'HS TN-28 / LS TN-09', 40],
  'Wend B70': ['TW-A8', 8, 'teamed', 2, 'ips', 'TWS-50', 50],
  'Orrin X90': ['TW-A10', 10, 'doubled', 1, 'ips', 'TWS-70', 70],
  'Halden B70': ['VK-D8', 8, 'doubled', 1, 'ips', 'VKS-70', 70],
  'Halden B50 ITX': ['VK-D6', 6, 'direct', 1, 'ips', 'VKS-55', 55],
  'KV Ridgeline B70 Lite': ['KV-PWM8', 8, 'direct', 1, 'ips', 'KVS-50', 50],
};

/** SoC rail stages, other rails */
const rails: Record<string, [number, string]> = {
  'KV Ridgeline B50': [1, '1 phase auxiliary'],
  'KV Ridgeline B50M': [1, '1 phase auxiliary'],
  'KV Ridgeline B70': [2, '1 stage auxiliary'],
  'KV Stratum X90': [2, '1 stage graphics, 1 stage auxiliary'],
  'KV Stratum X90 Thermal': [3, '1 stage graphics, 1 stage auxiliary'],
  'Holloway B50': [1, '1 phase auxiliary'],
  'Holloway B50 Mini': [1, '1 stage auxiliary'],
  'Holloway B70 Plus': [2, '1 stage auxiliary'],
  'Fenwright X90': [2, '1 stage graphics, 1 stage auxiliary'],
  'Cinderline B50': [1, '1 phase auxiliary'],
  'Cinderline B50M': [1, '1 phase auxiliary'],
  'Cinderline B70': [2, '1 stage auxiliary'],
  'Lanthorn X90': [2, '1 stage graphics, 1 stage auxiliary'],
  'Lanthorn X90 Duo': [3, '1 stage graphics, 2 stages auxiliary'],
  'Q-Marlpit B50': [1, '1 phase auxiliary'],
  'Q-Marlpit B70': [2, '1 stage auxiliary'],
  'Q-Marlpit B70M': [1, '1 stage auxiliary'],
  'Q-Tessellate X90': [2, '1 stage graphics, 1 stage auxiliary'],
  'Wend B50': [1, '1 phase auxiliary'],
  'Wend B70': [2, '1 stage auxiliary'],
  'Orrin X90': [2, '1 stage graphics, 1 stage auxiliary'],
  'Halden B70': [2, '1 stage auxiliary'],
  'Halden B50 ITX': [1, '1 stage auxiliary'],
  'KV Ridgeline B70 Lite': [1, '1 stage auxiliary'],
};

const heatsinks: Record<string, string> = {
  'KV Ridgeline B50': 'One low aluminium block over the top row only',
  'KV Ridgeline B50M': 'One small block, no heat pipe',
  'KV Ridgeline B70': 'Two finned blocks joined by a heat pipe',
  'KV Stratum X90': 'Two tall finned blocks, heat pipe, back plate under the stages',
  'KV Stratum X90 Thermal': 'Finned blocks with a 40 mm fan, full back plate',
  'Holloway B50': 'Flat plate over the top row',
  'Holloway B50 Mini': 'One L-shaped block with a heat pipe',
  'Holloway B70 Plus': 'Two finned blocks, no heat pipe',
  'Fenwright X90': 'Two tall blocks with a heat pipe and a back plate',
  'Cinderline B50': 'None over the lower row',
  'Cinderline B50M': 'One thin plate',
  'Cinderline B70': 'Two finned blocks joined by a heat pipe',
  'Lanthorn X90': 'Large finned blocks with heat pipe and back plate',
  'Lanthorn X90 Duo': 'Finned blocks with heat pipe, active fan, full back plate',
  'Q-Marlpit B50': 'Two flat blocks',
  'Q-Marlpit B70': 'Two finned blocks joined by a heat pipe',
  'Q-Marlpit B70M': 'One finned block with a heat pipe',
  'Q-Tessellate X90': 'Tall finned blocks, heat pipe, back plate',
  'Wend B50': 'One plate over the top row',
  'Wend B70': 'Two finned blocks',
  'Orrin X90': 'Two tall blocks with a heat pipe',
  'Halden B70': 'Two finned blocks with a heat pipe, back plate',
  'Halden B50 ITX': 'One stacked block with a heat pipe',
  'KV Ridgeline B70 Lite': 'One finned block',
};

/** rear USB [2.0, 5G, 10G, 20G, 40G], front USB-C header, LAN in Mbit/s, Wi-Fi, M.2 slots, SATA ports, I/O shield prefitted */
const io: Record<
  string,
  [
    [number, number, number, number, number],
    Features['frontUsbCHeader'],
    number,
    Features['wifi'],
    number,
    number,
    boolean,
  ]
> = {
  'KV Ridgeline B50': [[4, 2, 1, 0, 0], 'usb-5g', 1000, 'none', 2, 4, false],
  'KV Ridgeline B50M': [[4, 2, 0, 0, 0], 'none', 1000, 'none', 2, 4, false],
  'KV Ridgeline B70': [[4, 2, 2, 1, 0], 'usb-10g', 2500, 'wifi-6e', 3, 4, true],
  'KV Stratum X90': [[2, 4, 4, 2, 1], 'usb-20g', 5000, 'wifi-7', 5, 6, true],
  'KV Stratum X90 Thermal': [[2, 4, 4, 2, 2], 'usb-20g', 10000, 'wifi-7', 5, 8, true],
  'Holloway B50': [[4, 4, 0, 0, 0], 'usb-5g', 2500, 'none', 2, 4, false],
  'Holloway B50 Mini': [[2, 4, 2, 0, 0], 'usb-10g', 2500, 'wifi-6e', 2, 2, true],
  'Holloway B70 Plus': [[4, 2, 2, 1, 0], 'usb-10g', 2500, 'wifi-6e', 3, 6, true],
  'Fenwright X90': [[2, 4, 4, 2, 1], 'usb-20g', 5000, 'wifi-7', 4, 6, true],
  'Cinderline B50': [[6, 2, 0, 0, 0], 'none', 1000, 'none', 1, 4, false],
  'Cinderline B50M': [[4, 2, 0, 0, 0], 'none', 1000, 'wifi-6', 2, 4, false],
  'Cinderline B70': [[4, 2, 2, 1, 0], 'usb-20g', 2500, 'wifi-7', 4, 4, true],
  'Lanthorn X90': [[2, 4, 4, 2, 1], 'usb-20g', 5000, 'wifi-7', 5, 6, true],
  'Lanthorn X90 Duo': [[2, 4, 6, 2, 2], 'usb-20g', 10000, 'wifi-7', 6, 8, true],
  'Q-Marlpit B50': [[4, 2, 2, 0, 0], 'usb-5g', 2500, 'wifi-6', 2, 4, true],
  'Q-Marlpit B70': [[4, 2, 2, 1, 0], 'usb-10g', 2500, 'wifi-6e', 3, 4, true],
  'Q-Marlpit B70M': [[4, 2, 1, 0, 0], 'usb-10g', 2500, 'wifi-6e', 2, 4, true],
  'Q-Tessellate X90': [[2, 4, 4, 2, 1], 'usb-20g', 5000, 'wifi-7', 5, 6, true],
  'Wend B50': [[4, 2, 0, 0, 0], 'none', 1000, 'none', 2, 4, false],
  'Wend B70': [[4, 2, 2, 0, 0], 'usb-10g', 2500, 'wifi-6e', 3, 4, true],
  'Orrin X90': [[2, 4, 4, 1, 0], 'usb-20g', 5000, 'wifi-7', 4, 6, true],
  'Halden B70': [[2, 4, 2, 1, 0], 'usb-20g', 5000, 'wifi-7', 4, 4, true],
  'Halden B50 ITX': [[2, 4, 2, 0, 0], 'usb-10g', 2500, 'wifi-7', 2, 2, true],
  'KV Ridgeline B70 Lite': [[4, 2, 1, 0, 0], 'usb-5g', 2500, 'wifi-6', 2, 4, false],
};

const audio: Record<string, string> = {
  'KV Ridgeline B50': '7.1 HD audio',
  'KV Ridgeline B50M': '5.1 HD audio',
  'KV Ridgeline B70': '7.1 HD audio, optical out',
  'KV Stratum X90': '7.1 HD audio, optical out, headphone amplifier',
  'KV Stratum X90 Thermal': '7.1 HD audio, optical out, headphone amplifier',
  'Holloway B50': '7.1 HD audio',
  'Holloway B50 Mini': '7.1 HD audio',
  'Holloway B70 Plus': '7.1 HD audio, optical out',
  'Fenwright X90': '7.1 HD audio, optical out',
  'Cinderline B50': '5.1 HD audio',
  'Cinderline B50M': '5.1 HD audio',
  'Cinderline B70': '7.1 HD audio, optical out',
  'Lanthorn X90': '7.1 HD audio, optical out',
  'Lanthorn X90 Duo': '7.1 HD audio, optical out, headphone amplifier',
  'Q-Marlpit B50': '7.1 HD audio',
  'Q-Marlpit B70': '7.1 HD audio, optical out',
  'Q-Marlpit B70M': '7.1 HD audio',
  'Q-Tessellate X90': '7.1 HD audio, optical out',
  'Wend B50': '5.1 HD audio',
  'Wend B70': '7.1 HD audio',
  'Orrin X90': '7.1 HD audio, optical out',
  'Halden B70': '7.1 HD audio, optical out',
  'Halden B50 ITX': '7.1 HD audio',
  'KV Ridgeline B70 Lite': '7.1 HD audio',
};

/**
 * model, market, days before the seed date, price in minor units (euro cents in DE, pence in GB).
 * DE rows oldest first; at most one (the latest) GB row a board.
 */
const prices: [string, 'de' | 'gb', number, number][] = [
  ['KV Ridgeline B50', 'de', 120, 14990],
  ['KV Ridgeline B50', 'de', 60, 13990],
  ['KV Ridgeline B50', 'de', 8, 13490],
  ['KV Ridgeline B50', 'gb', 9, 11999],
  ['KV Ridgeline B50M', 'de', 90, 12490],
  ['KV Ridgeline B50M', 'de', 10, 11990],
  ['KV Ridgeline B70', 'de', 100, 21990],
  ['KV Ridgeline B70', 'de', 40, 19990],
  ['KV Ridgeline B70', 'de', 6, 18990],
  ['KV Ridgeline B70', 'gb', 6, 16999],
  ['KV Stratum X90', 'de', 150, 42990],
  ['KV Stratum X90', 'de', 70, 39990],
  ['KV Stratum X90', 'de', 5, 37990],
  ['KV Stratum X90', 'gb', 5, 33999],
  ['KV Stratum X90 Thermal', 'de', 60, 54990],
  ['KV Stratum X90 Thermal', 'de', 12, 52990],
  ['Holloway B50', 'de', 80, 15490],
  ['Holloway B50', 'de', 20, 14490],
  ['Holloway B50 Mini', 'de', 70, 17990],
  ['Holloway B50 Mini', 'de', 4, 16990],
  ['Holloway B70 Plus', 'de', 110, 22990],
  ['Holloway B70 Plus', 'de', 45, 20990],
  ['Holloway B70 Plus', 'de', 3, 19490],
  ['Holloway B70 Plus', 'gb', 3, 17499],
  ['Fenwright X90', 'de', 140, 38990],
  ['Fenwright X90', 'de', 50, 36990],
  ['Fenwright X90', 'de', 7, 35990],
  ['Cinderline B50', 'de', 60, 11990],
  ['Cinderline B50', 'de', 5, 10990],
  ['Cinderline B50M', 'de', 50, 11490],
  ['Cinderline B50M', 'de', 9, 10490],
  ['Cinderline B70', 'de', 90, 20990],
  ['Cinderline B70', 'de', 30, 19990],
  ['Cinderline B70', 'de', 2, 20490],
  ['Cinderline B70', 'gb', 2, 17999],
  ['Lanthorn X90', 'de', 160, 34990],
  ['Lanthorn X90', 'de', 60, 32990],
  ['Lanthorn X90', 'de', 6, 31990],
  ['Lanthorn X90', 'gb', 6, 27999],
  ['Lanthorn X90 Duo', 'de', 40, 62990],
  ['Lanthorn X90 Duo', 'de', 11, 59990],
  ['Q-Marlpit B50', 'de', 75, 16490],
  ['Q-Marlpit B50', 'de', 14, 15490],
  ['Q-Marlpit B70', 'de', 95, 19990],
  ['Q-Marlpit B70', 'de', 35, 18990],
  ['Q-Marlpit B70', 'de', 4, 17990],
  ['Q-Marlpit B70', 'gb', 4, 15999],
  ['Q-Marlpit B70M', 'de', 200, 17990],
  ['Q-Tessellate X90', 'de', 130, 41990],
  ['Q-Tessellate X90', 'de', 55, 39990],
  ['Q-Tessellate X90', 'de', 10, 38990],
  ['Wend B50', 'de', 40, 9990],
  ['Wend B50', 'de', 7, 9490],
  ['Wend B70', 'de', 60, 17490],
  ['Wend B70', 'de', 5, 16490],
  ['Orrin X90', 'de', 85, 31990],
  ['Orrin X90', 'de', 15, 29990],
  ['Halden B70', 'de', 30, 22990],
  ['Halden B70', 'de', 3, 22990],
  ['Halden B50 ITX', 'de', 25, 18990],
  ['Halden B50 ITX', 'de', 6, 18490],
  ['KV Ridgeline B70 Lite', 'de', 20, 15990],
  ['KV Ridgeline B70 Lite', 'de', 2, 15490],
];

export interface DemoBoard {
  product: ProductInput;
  pricesDe: { daysAgo: number; amountMinor: number }[];
  priceGb: { daysAgo: number; amountMinor: number } | null;
}

/** The row of a per-model table; a board missing from one is a mistake in this file. */
function row<T>(table: Record<string, T>, model: string): T {
  const found = table[model];
  if (found === undefined) throw new Error(`demo catalog: no row for ${model}`);
  return found;
}

const pricePoint = ([, , daysAgo, amountMinor]: (typeof prices)[number]) => ({ daysAgo, amountMinor });

export const demoBoards: DemoBoard[] = boards.map(([maker, model, chipset, formFactor, releaseDate]) => {
  const [controller, controllerPhases, phaseMultiplication, stagesPerPhase, stage, stagePart, stageA] = row(
    vcore,
    model,
  );
  const [socRailStages, otherRails] = row(rails, model);
  const [rearUsb, frontUsbC, lanMbps, wifi, m2, sata, ioShield] = row(io, model);
  const gb = prices.find(([m, market]) => m === model && market === 'gb');
  return {
    product: {
      maker,
      model,
      category: 'motherboard',
      platform: DEMO_PLATFORM,
      socket: SOCKET,
      chipset,
      formFactor,
      releaseDate,
      powerDesign: {
        controller,
        controllerPhases,
        phaseMultiplication,
        stagesPerPhase,
        vcoreStageType: stage === 'ips' ? 'integrated-power-stage' : 'discrete-mosfets',
        vcoreStagePart: stagePart,
        vcoreStageCurrentA: stageA,
        socRailStages,
        otherRails,
        heatsinkNotes: row(heatsinks, model),
      },
      features: {
        rearUsb: {
          usb2: rearUsb[0],
          usb5g: rearUsb[1],
          usb10g: rearUsb[2],
          usb20g: rearUsb[3],
          usb40g: rearUsb[4],
        },
        frontUsbCHeader: frontUsbC,
        lanSpeedMbps: lanMbps,
        wifi,
        m2Slots: m2,
        sataPorts: sata,
        audio: row(audio, model),
        ioShieldPrefitted: ioShield,
      },
    },
    pricesDe: prices.filter(([m, market]) => m === model && market === 'de').map(pricePoint),
    priceGb: gb ? pricePoint(gb) : null,
  };
});

/** Shops the demo prices were "seen" at. */
export const demoShops = ['Kettleby Components', 'Parts Larder', 'Ferrow & Hale', 'Voltmarket'];
