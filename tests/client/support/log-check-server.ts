import { analyseLog } from '../../../shared/domain/analysis/analyse-log';
import type { AnalysisRequestInput } from '../../../shared/schemas/analysis';
import type { SentUpload } from './fake-upload-server';

/**
 * Answers POST /api/log-check/analyse as the route does, with the real analysis from shared/: 200 { preview, analysis }
 * or 422 { error: { code: 'log_parse_failed', message, details: { preview, errors } } }.
 */
export async function answerLogCheck(request: SentUpload): Promise<{ status: number; body: unknown }> {
  if (!request.file) return { status: 400, body: { error: { code: 'validation_failed', message: 'Attach a file.' } } };
  const settings = (request.fields.request ? JSON.parse(request.fields.request) : {}) as AnalysisRequestInput;
  const outcome = analyseLog(await request.file.text(), settings);
  if (outcome.ok) return { status: 200, body: { preview: outcome.preview, analysis: outcome.analysis } };
  return {
    status: 422,
    body: {
      error: {
        code: 'log_parse_failed',
        message: 'The logger file could not be read. See the listed rows and columns.',
        details: { preview: outcome.preview ?? null, errors: outcome.errors },
      },
    },
  };
}

/**
 * A soak whose answer is known from first principles, not from the engine: a first-order (Newtonian) rise
 * T(t) = 21.0 + 50·(1 − e^(−t/300)) °C, logged every 10 s for 60 minutes, room steady at 21.0 °C, clock holding
 * 5000 MHz. After 3600 s = 12 τ the rise is within 50·e^(−12) ≈ 0.0003 °C of 71.0 °C, so the peak is 71.0 °C.
 */
export function firstOrderSoakCsv(): string {
  const lines = ['Time [s],VRM 1 [°C],Ambient [°C],CPU clock [MHz]'];
  for (let t = 0; t < 3600; t += 10) {
    const vrmC = 21 + 50 * (1 - Math.exp(-t / 300));
    lines.push(`${t},${vrmC.toFixed(2)},21.00,5000`);
  }
  return `${lines.join('\n')}\n`;
}

/** The same soak with the VRM reading at t = 300 s typed over; it sits on line 32 (the header is line 1). */
export function soakWithBadCellCsv(): string {
  const lines = firstOrderSoakCsv().split('\n');
  lines[31] = lines[31].replace(/^300,[^,]+,/, '300,n/a?,');
  return lines.join('\n');
}

export function csvFile(name: string, text: string): File {
  return new File([text], name, { type: 'text/csv' });
}
