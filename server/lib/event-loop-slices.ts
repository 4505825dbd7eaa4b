import { createHash } from 'node:crypto';
import { setImmediate as nextTurn } from 'node:timers/promises';

/**
 * Work over a large upload in slices, with a turn of the event loop between them, so other requests are answered
 * while it runs. One slice of 1 MiB takes a few milliseconds; a whole 24 MB file in one go holds the loop for tens.
 */
const sliceBytes = 1 << 20;

/** SHA-256 (hex) of the bytes, hashed slice by slice. */
export async function sha256InSlices(bytes: Uint8Array): Promise<string> {
  const hash = createHash('sha256');
  for (let start = 0; start < bytes.length; start += sliceBytes) {
    hash.update(bytes.subarray(start, start + sliceBytes));
    if (start + sliceBytes < bytes.length) await nextTurn();
  }
  return hash.digest('hex');
}

/**
 * A copy of the bytes in memory shared with worker threads, copied slice by slice. Handing it to a worker costs
 * nothing on this thread; a plain buffer would be copied whole, at once, by the message to the worker.
 */
export async function sharedCopyInSlices(bytes: Uint8Array): Promise<Uint8Array> {
  const copy = new Uint8Array(new SharedArrayBuffer(bytes.length));
  for (let start = 0; start < bytes.length; start += sliceBytes) {
    copy.set(bytes.subarray(start, start + sliceBytes), start);
    if (start + sliceBytes < bytes.length) await nextTurn();
  }
  return copy;
}
