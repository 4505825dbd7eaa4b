import { spawn, type ChildProcess } from 'node:child_process';
import { once } from 'node:events';
import { resolve } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { RoundupEntity } from '../../../server/entities/roundup.entity';
import { RoundupPublicationEntity } from '../../../server/entities/roundup-publication.entity';
import { signedIn, testApp, testDataSource, type TestApp } from '../support/test-app';
import { roundupInReview, scheduleAt } from './support/publishing-fixtures';

let dataSource: DataSource;
let app: TestApp;

/** Starts a process running only the job runner, and waits until it polls. */
async function startRunnerProcess(): Promise<ChildProcess> {
  const child = spawn(
    process.execPath,
    ['--import', 'tsx', resolve(import.meta.dirname, 'support/job-runner-process.ts')],
    { env: { ...process.env, NODE_ENV: 'test' }, stdio: ['ignore', 'pipe', 'inherit'] },
  );
  let output = '';
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const deadline = Date.now() + 60_000;
  while (!output.includes('runner ready')) {
    if (child.exitCode !== null) throw new Error(`the runner process exited with ${child.exitCode}`);
    if (Date.now() > deadline) throw new Error('the runner process did not start within a minute');
    await new Promise((r) => setTimeout(r, 100));
  }
  return child;
}

async function stateOf(roundupId: number) {
  return (await dataSource.getRepository(RoundupEntity).findOneByOrFail({ id: roundupId })).state;
}

beforeAll(async () => {
  dataSource = await testDataSource();
  app = await testApp();
});

describe('a runner killed before the embargo', () => {
  it('publishes at restart, once', async () => {
    const { agent: editor } = await signedIn(app, 'editor');
    const { roundupId } = await roundupInReview(app, editor, dataSource);
    const first = await startRunnerProcess();
    const at = new Date(Math.ceil((Date.now() + 2_000) / 1000) * 1000);
    await scheduleAt(editor, roundupId, at, 'UTC');

    first.kill('SIGKILL');
    await once(first, 'exit');
    // The time passes with no runner alive: the roundup stays scheduled and unseen.
    while (Date.now() < at.getTime() + 1_000) await new Promise((r) => setTimeout(r, 200));
    expect(await stateOf(roundupId)).toBe('scheduled');

    const second = await startRunnerProcess();
    try {
      await expect.poll(() => stateOf(roundupId), { timeout: 20_000, interval: 200 }).toBe('live');
      expect(await dataSource.getRepository(RoundupPublicationEntity).countBy({ roundupId })).toBe(1);
    } finally {
      second.kill('SIGKILL');
      await once(second, 'exit');
    }
  }, 120_000);
});
