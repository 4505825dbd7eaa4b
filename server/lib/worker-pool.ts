import { availableParallelism } from 'node:os';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import { workerFile } from '../worker-file';

export interface WorkerPoolOptions {
  /** Tasks waiting for a thread before new ones are refused. */
  maxQueue: number;
  /** Heap of one worker thread; a task over it ends that thread (ERR_WORKER_OUT_OF_MEMORY), not the server. */
  maxHeapMb: number;
  /** A thread idle this long exits; the next task starts one again. */
  idleTimeoutMs: number;
}

/**
 * A piscina pool for the worker entry server/workers/<name>.ts, built on its first task (a server that never gets one
 * starts no thread). One core is left to the event loop: the pool has at most (cores − 1) threads, at least one.
 */
export function lazyWorkerPool(name: string, options: WorkerPoolOptions) {
  let pool: Piscina | null = null;
  const start = () => {
    const file = workerFile(name);
    const fromSource = file.endsWith('.ts');
    return new Piscina({
      filename: fromSource ? fileURLToPath(new URL('../workers/typescript-worker.mjs', import.meta.url)) : file,
      workerData: fromSource ? { typescriptEntry: pathToFileURL(file).href } : undefined,
      minThreads: 0,
      maxThreads: Math.max(1, availableParallelism() - 1),
      maxQueue: options.maxQueue,
      idleTimeout: options.idleTimeoutMs,
      resourceLimits: { maxOldGenerationSizeMb: options.maxHeapMb },
      // The lowest priority where the system allows it (piscina's optional @napi-rs/nice, per thread on Linux): on a
      // machine short of cores, requests are answered first and the work takes the rest. Worker entries also lower
      // their own thread with os.setPriority, which needs no optional package.
      niceIncrement: 19,
    });
  };
  return {
    run<T>(task: unknown, signal: AbortSignal): Promise<T> {
      pool ??= start();
      return pool.run(task, { signal }) as Promise<T>;
    },
    async close(): Promise<void> {
      const running = pool;
      pool = null;
      await running?.destroy();
    },
  };
}

export type LazyWorkerPool = ReturnType<typeof lazyWorkerPool>;
