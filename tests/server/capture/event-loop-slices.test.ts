import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { sha256InSlices, sharedCopyInSlices } from '../../../server/lib/event-loop-slices';

/** Large uploads are hashed and copied for the worker pool in slices, with the same answer as in one go. */
describe('work over an upload in slices', () => {
  it('hashes "abc" to the SHA-256 of the FIPS 180-2 example (appendix B.1)', async () => {
    expect(await sha256InSlices(new TextEncoder().encode('abc'))).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    );
  });

  it('hashes a file of several slices as node:crypto does in one go, and copies it byte for byte', async () => {
    // 3.5 MiB of varied bytes: three whole slices and a part.
    const bytes = new Uint8Array(3.5 * 1024 * 1024);
    for (let index = 0; index < bytes.length; index++) bytes[index] = (index * 31 + (index >> 11)) & 0xff;
    expect(await sha256InSlices(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
    const copy = await sharedCopyInSlices(bytes);
    expect(copy.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(Buffer.compare(Buffer.from(copy.buffer), Buffer.from(bytes))).toBe(0);
  });
});
