import { logAnalysisLimits, logFileUploadLimit } from '../upload-limits';

/**
 * The logger file that takes Log check longest among those it accepts, for the benchmark and the "server stays
 * responsive" test. Measured here over files at the limits (2 to 512 columns, decimals and whole numbers): the cost
 * follows the number of rows, so the worst is a narrow log (time, one VRM probe, ambient) with as many rows as the
 * cell limit allows, in short cells, within the upload size limit — about 1.7 million rows, 22 MB.
 */
export function worstAcceptedLog(): string {
  const columns = 3;
  const header = 'Time [s],VRM 1 [°C],Ambient [°C]';
  const lines = [header];
  let bytes = Buffer.byteLength(header) + 1;
  const rows = Math.floor(logAnalysisLimits.maxCells / columns) - 1;
  for (let row = 0; row < rows; row++) {
    // A 10 Hz soak: the probe climbs from 40 to 80 °C in whole degrees, the room holds 21 °C.
    const line = `${(row / 10).toFixed(1)},${40 + Math.min(40, Math.floor(row / 20_000))},21`;
    bytes += line.length + 1;
    if (bytes > logFileUploadLimit.maxFileBytes) break;
    lines.push(line);
  }
  return lines.join('\n');
}
