import { describe, expect, it } from 'vitest';
import { signedIn, testApp } from './support/test-app';

/**
 * A 60-minute soak logged every 10 s: the VRM probe follows a first-order rise from 21 °C towards
 * 21 + 50 °C with τ = 300 s, ambient holds 21.0 °C and the clock 5000 MHz. First principles: after
 * 12τ the rise is 50·(1 − e⁻¹²) = 49.9997 °C, so the peak is 71.0 °C at the end, 50.0 °C over ambient.
 */
function firstOrderRiseLog(endS = 3600, deadProbe = false) {
  const lines = [`Elapsed (s),VRM rear (°C),Ambient (°C),CPU clock (MHz)${deadProbe ? ',VRM front (°C)' : ''}`];
  for (let t = 0; t <= endS; t += 10) {
    const vrm = 21 + 50 * (1 - Math.exp(-t / 300));
    lines.push(`${t},${vrm.toFixed(2)},21.0,5000${deadProbe ? ',OPEN' : ''}`);
  }
  return lines.join('\n');
}

const mapping = { time: 'Elapsed (s)', vrm: ['VRM rear (°C)'], ambient: 'Ambient (°C)', clock: 'CPU clock (MHz)' };

describe('POST /api/log-check/analyse', () => {
  it('when a tester uploads a clean hour-long log, then the preview and the analysis come back', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'tester');
    const response = await agent
      .post('/api/log-check/analyse')
      .attach('file', Buffer.from(firstOrderRiseLog()), 'soak.csv')
      .field('request', JSON.stringify({ mapping, options: { soakMinutes: 60 } }));
    expect(response.status, response.text).toBe(200);
    expect(response.body.preview.columns.map((c: { name: string }) => c.name)).toContain('VRM rear (°C)');
    const analysis = response.body.analysis;
    expect(analysis.peakC).toBeCloseTo(71.0, 1); // first principles, see above
    expect(analysis.ambientMeanC).toBeCloseTo(21.0, 6);
    expect(analysis.deltaOverAmbientC).toBeCloseTo(50.0, 1);
    expect(analysis.throttle.detected).toBe(false);
    // Below ~80 °C without throttling: the easy pass (common practice, no source).
    expect(analysis.verdict.code).toBe('comfortable');
    expect(analysis.verdict.rule).toEqual(expect.any(String));
  });

  it('when the soak is cut short, then the API withholds the verdict or marks it provisional, in words', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'tester');
    const send = (endS: number) =>
      agent
        .post('/api/log-check/analyse')
        .attach('file', Buffer.from(firstOrderRiseLog(endS)), 'soak.csv')
        .field('request', JSON.stringify({ mapping, options: { soakMinutes: 60 } }));
    // 5 min = 1 τ: 63 % of the rise shown (first-order step response 1 − e^(−t/τ)), too little to predict from.
    const early = await send(300);
    expect(early.status, early.text).toBe(200);
    expect(early.body.analysis.verdict).toMatchObject({ status: 'withheld', code: null, label: 'No verdict yet' });
    // 20 min = 4 τ: 98 % shown; the fitted plateau is 71.0 °C (first principles), Comfortable, but provisional.
    const later = await send(1200);
    expect(later.body.analysis.verdict).toMatchObject({
      status: 'provisional',
      code: 'comfortable',
      label: 'Provisional: Comfortable',
      judgedFrom: 'predicted-steady-state',
    });
    expect(later.body.analysis.verdict.judgedC).toBeCloseTo(71.0, 0);
  });

  it('when a mapped VRM probe read nothing, then the verdict waits until the tester confirms it as dead', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'tester');
    const deadMapping = { ...mapping, vrm: ['VRM rear (°C)', 'VRM front (°C)'] };
    const send = (options: object) =>
      agent
        .post('/api/log-check/analyse')
        .attach('file', Buffer.from(firstOrderRiseLog(3600, true)), 'soak.csv')
        .field('request', JSON.stringify({ mapping: deadMapping, options }));
    const blocked = await send({});
    expect(blocked.status, blocked.text).toBe(200);
    expect(blocked.body.analysis.verdict).toMatchObject({ status: 'withheld', code: null });
    expect(blocked.body.analysis.flags[0]).toMatchObject({ code: 'probe-dead', label: 'Dead probe' });
    const confirmed = await send({ confirmedDeadProbes: ['VRM front (°C)'] });
    expect(confirmed.body.analysis.verdict).toMatchObject({ status: 'final', code: 'comfortable' });
  });

  it('a UTF-16 export with a byte-order mark reads the same as UTF-8', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'editor');
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(firstOrderRiseLog(), 'utf16le')]);
    const response = await agent
      .post('/api/log-check/analyse')
      .attach('file', utf16, 'soak.txt')
      .field('request', JSON.stringify({ mapping }));
    expect(response.status, response.text).toBe(200);
    expect(response.body.analysis.peakC).toBeCloseTo(71.0, 1);
  });

  it('when a cell holds text where a temperature belongs, then 422 names the row and column', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'tester');
    const text = ['Elapsed (s),VRM rear (°C),Ambient (°C)', '0,40.0,21.0', '10,hot,21.0', '20,41.0,21.0'].join('\n');
    const response = await agent
      .post('/api/log-check/analyse')
      .attach('file', Buffer.from(text), 'bad.csv')
      .field(
        'request',
        JSON.stringify({ mapping: { time: 'Elapsed (s)', vrm: ['VRM rear (°C)'], ambient: 'Ambient (°C)' } }),
      );
    expect(response.status).toBe(422);
    expect(response.body.error.code).toBe('log_parse_failed');
    // The agreed shape: the preview (null when the table itself could not be read) and every parse error in details.
    expect(response.body.error.details.preview.columns).toHaveLength(3);
    expect(response.body.error.details.errors).toEqual(
      expect.arrayContaining([expect.objectContaining({ row: 3, column: 'VRM rear (°C)' })]),
    );
  });

  it('a missing file, bad settings JSON and a binary file are refused with clear errors', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'tester');
    const noFile = await agent.post('/api/log-check/analyse').field('request', '{}');
    expect(noFile.status).toBe(400);
    expect(noFile.body.error.fields.file).toBeTruthy();
    const badJson = await agent
      .post('/api/log-check/analyse')
      .attach('file', Buffer.from(firstOrderRiseLog()), 'soak.csv')
      .field('request', '{not json');
    expect(badJson.status).toBe(400);
    expect(badJson.body.error.fields.request).toBeTruthy();
    const binary = await agent
      .post('/api/log-check/analyse')
      .attach('file', Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x00, 0x00]), 'soak.csv');
    expect(binary.status).toBe(415);
    const wrongType = await agent.post('/api/log-check/analyse').attach('file', Buffer.from('x'), 'photo.jpg');
    expect(wrongType.status).toBe(415);
  });
});
