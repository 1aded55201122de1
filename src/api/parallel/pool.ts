import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { PairTask, Task, TaskResult } from './tasks.js';
import type { ScorePart } from '../../evaluate/score-conversion.js';
import type { StretchEvent, StretchTask } from './sentence-work.js';

/** The number of jobs a run uses when none is asked for: TREEBRIDGE_JOBS when set to a whole number, else one per core. */
export function defaultJobs(): number {
  const set = process.env.TREEBRIDGE_JOBS;
  if (set !== undefined && /^[1-9]\d*$/.test(set)) return Number(set);
  return availableParallelism();
}

/**
 * A pool of worker threads (piscina) running tasks of ./worker.js. The
 * threads start at once and stay until `close`, so a run pays their start-up
 * once.
 */
export class WorkerPool {
  private readonly pool: Piscina;

  /** The worker's module; it exists once built (running from the TypeScript sources there is none to start). */
  static readonly module = new URL('./worker.js', import.meta.url);

  /**
   * Tasks each thread holds at once: the one it works on and the next, posted
   * to it already, so that it need not wait for the main thread (busy with its
   * own share) to hand over the next task.
   */
  static readonly queued = 2;

  static get available(): boolean {
    return existsSync(fileURLToPath(WorkerPool.module));
  }

  constructor(
    readonly threads: number,
    /**
     * The young generation of each thread, in MB. Pairs scored build whole trees and gold
     * sentences and keep a large one; tasks of a few KiB of trees or sentences do as well with
     * half (measured: the same time, some 10 MB less at two jobs).
     */
    youngMb = 16,
  ) {
    this.pool = new Piscina({
      filename: WorkerPool.module.href,
      minThreads: threads,
      maxThreads: threads,
      // Tasks are queued by the caller, in order and few at a time; the pool needs no queue limit of its own.
      concurrentTasksPerWorker: WorkerPool.queued,
      resourceLimits: { maxYoungGenerationSizeMb: youngMb, maxOldGenerationSizeMb: 96 },
    });
  }

  run(task: Task): Promise<TaskResult>;
  run(task: StretchTask): Promise<StretchEvent[]>;
  run(task: PairTask): Promise<ScorePart>;
  run(task: Task | StretchTask | PairTask): Promise<TaskResult | StretchEvent[] | ScorePart> {
    return this.pool.run(task) as Promise<TaskResult | StretchEvent[] | ScorePart>;
  }

  async close(): Promise<void> {
    await this.pool.destroy();
  }
}

/**
 * Shares tasks between the main thread and N - 1 worker threads: a task goes
 * to a worker when one is free, else the main thread does it at once, so that
 * no thread waits for another while there is work (the workers still starting,
 * or the main thread with more reading to do). The first task is always the
 * main thread's, so that a small input starts no thread. Without a built
 * worker module (run from the sources), the main thread does every task.
 */
export class SharedJobs {
  readonly jobs: number;
  private pool: WorkerPool | undefined;
  private given = 0;
  /** Tasks handed to the workers and not yet done. */
  private busy = 0;

  constructor(
    jobs: number,
    /** The workers' young generation, in MB (see WorkerPool). */
    private readonly youngMb = 16,
  ) {
    this.jobs = WorkerPool.available ? jobs : 1;
  }

  /** Does a task: `here` on this thread, or `there` on a free worker. */
  take<T>(here: () => T, there: (pool: WorkerPool) => Promise<T>): T | Promise<T> {
    if (this.jobs === 1 || this.given++ === 0 || this.busy >= WorkerPool.queued * (this.jobs - 1)) return here();
    this.pool ??= new WorkerPool(this.jobs - 1, this.youngMb);
    this.busy++;
    return there(this.pool).finally(() => this.busy--);
  }

  /**
   * Lets the event loop turn once, so that tasks the workers finished are
   * counted as done before the next is shared out: a caller that reads and
   * cuts without waiting would otherwise see its workers busy long after they
   * are done, and do their share itself. Call it before each `take`.
   */
  async settle(): Promise<void> {
    if (this.busy > 0) await new Promise<void>((resolve) => setImmediate(resolve));
  }

  async close(): Promise<void> {
    await this.pool?.close();
  }
}

/**
 * Results of tasks in the order the tasks were given, each known to have come
 * or not without waiting for it: a result that has come leaves at once, since
 * one held while others are done would outlive two young collections and be
 * moved to the old generation, which only a full collection frees.
 */
export class InOrder<T> {
  private readonly items: Array<{ value: T | Promise<T>; ready: boolean }> = [];

  get length(): number {
    return this.items.length;
  }

  /** The first result has come. */
  get firstReady(): boolean {
    return this.items[0]?.ready ?? false;
  }

  push(value: T | Promise<T>): void {
    const item = { value, ready: !(value instanceof Promise) };
    // A failure is seen by whoever takes the result; here it only must not go unhandled.
    if (value instanceof Promise) void value.then(() => (item.ready = true), () => undefined);
    this.items.push(item);
  }

  /** The first result, once it has come. */
  async shift(): Promise<T> {
    return await this.items.shift()!.value;
  }
}
