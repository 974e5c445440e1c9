/**
 * Messages between `collab-bench.ts` and its forked client workers (`collab-client-worker.ts`),
 * plus the clock both sides stamp with. Spreading clients over processes keeps the benchmark's
 * own decoding off the relay's critical path as far as two shared cores allow.
 */

/**
 * How a simulated client behaves:
 * - `editor`: full client (Y.Doc), edits twice a second, times every remote edit it applies;
 * - `decoder`: read-only full client (Y.Doc) that times each probe by the stamp inside it;
 * - `arrival`: read-only raw socket that never decodes an update: it records when each
 *   `plan:synced` update frame arrives (the parent pairs the k-th arrival with the k-th probe);
 * - `presence`: full client that moves its cursor once a second;
 * - `idle`: full client that only joins (keeps a room open).
 */
export type ClientMode = 'editor' | 'decoder' | 'arrival' | 'presence' | 'idle';

export interface ClientSpec {
  user: string;
  plan: string;
  mode: ClientMode;
  /** Where in its period this client's edits or presence moves fall, in [0, 1). */
  phase: number;
}

export type ToWorker =
  | { kind: 'connect'; url: string; clients: ClientSpec[] }
  | { kind: 'clock' }
  | { kind: 'go'; seconds: number }
  | { kind: 'collect' }
  | { kind: 'close' };

/** What one worker measured during one scenario. */
export interface WorkerResult {
  /** edit/probe → apply, from the stamp inside the update (editor and decoder clients). */
  stampLatency: number[];
  /** edit → durable ack (editor clients). */
  ackLatency: number[];
  /** Arrival times of update frames, one list per `arrival` client, in arrival order. */
  arrivals: number[][];
  edits: number;
  /** Worker CPU over the scenario, in cores (user + system time / wall time). */
  cpuCores: number;
}

export type FromWorker =
  | { kind: 'connected' }
  | { kind: 'clock'; now: number }
  | { kind: 'going' }
  | { kind: 'result'; result: WorkerResult }
  | { kind: 'closed' }
  | { kind: 'failed'; message: string };

/**
 * Wall-clock milliseconds with sub-millisecond resolution, comparable between processes on one
 * machine: each process's `timeOrigin` is taken from the system clock at its start, and
 * `performance.now()` is monotonic from there. The parent checks the agreement between
 * processes with a round trip and prints it.
 */
export function benchNow(): number {
  return performance.timeOrigin + performance.now();
}
