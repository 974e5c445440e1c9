/**
 * Drawn intent: how a signal is meant to move, as drawn by an engineer beside the computed
 * curve. A ramp from `start` to `end` (seconds) up to `level` (volts), optionally bent by
 * breakpoints. Breakpoints are keyed by id so two users dragging different points merge.
 */
import * as Y from 'yjs';

import { collection, type EntryMap } from './doc-layout';

/** One breakpoint of a drawn ramp. */
export interface IntentPoint {
  /** Stable id of the point within its signal. */
  id: string;
  /** Time, seconds. */
  t: number;
  /** Level, volts. */
  v: number;
}

/** The drawn intent of one signal. */
export interface DrawnIntent {
  /** When the ramp starts, seconds. */
  start: number;
  /** When it reaches `level`, seconds (≥ start). */
  end: number;
  /** Settled level, volts. */
  level: number;
  /** Breakpoints between start and end, sorted by time then id. */
  points: IntentPoint[];
}

/** Intents by signal id. */
export type IntentTable = Record<string, DrawnIntent>;

const POINTS_KEY = 'points';

/** Problems of a drawn intent, each naming the signal and field; empty when valid. */
export function intentProblems(signalId: string, intent: DrawnIntent): string[] {
  const problems: string[] = [];
  for (const field of ['start', 'end', 'level'] as const) {
    if (!Number.isFinite(intent[field]))
      problems.push(`intent of signal ${signalId}: ${field} must be a finite number`);
  }
  if (intent.start < 0) problems.push(`intent of signal ${signalId}: start must be ≥ 0 s`);
  if (intent.end < intent.start)
    problems.push(`intent of signal ${signalId}: end must not be before start`);
  const seen = new Set<string>();
  for (const p of intent.points) {
    if (p.id.length === 0 || seen.has(p.id))
      problems.push(`intent of signal ${signalId}: point id "${p.id}" is empty or repeated`);
    seen.add(p.id);
    if (!Number.isFinite(p.t) || !Number.isFinite(p.v))
      problems.push(`intent of signal ${signalId}, point ${p.id}: t and v must be finite numbers`);
  }
  return problems;
}

/** Reads one intent entry; missing numbers read as 0 (a half-written entry never gives NaN). */
export function readIntent(entry: EntryMap): DrawnIntent {
  const points: IntentPoint[] = [];
  const pts = entry.get(POINTS_KEY);
  if (pts instanceof Y.Map) {
    for (const [id, value] of pts.entries()) {
      const p = value as { t?: unknown; v?: unknown };
      if (typeof p?.t === 'number' && typeof p?.v === 'number') points.push({ id, t: p.t, v: p.v });
    }
  }
  points.sort((a, b) => a.t - b.t || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  return {
    start: numberOr(entry.get('start'), 0),
    end: numberOr(entry.get('end'), 0),
    level: numberOr(entry.get('level'), 0),
    points,
  };
}

/** Every drawn intent in the doc. */
export function readIntents(doc: Y.Doc): IntentTable {
  const out: IntentTable = {};
  const map = collection(doc, 'intents');
  for (const id of [...map.keys()].sort()) {
    const entry = map.get(id);
    if (entry instanceof Y.Map) out[id] = readIntent(entry);
  }
  return out;
}

/** Writes a whole intent (replacing any previous one). Call inside a transaction. */
export function writeIntent(doc: Y.Doc, signalId: string, intent: DrawnIntent): void {
  const entry = new Y.Map<unknown>();
  collection(doc, 'intents').set(signalId, entry);
  entry.set('start', intent.start);
  entry.set('end', intent.end);
  entry.set('level', intent.level);
  const pts = new Y.Map<unknown>();
  entry.set(POINTS_KEY, pts);
  for (const p of intent.points) pts.set(p.id, { t: p.t, v: p.v });
}

/** The breakpoints map of an intent entry, created when missing. Call inside a transaction. */
export function intentPoints(entry: EntryMap): Y.Map<unknown> {
  const pts = entry.get(POINTS_KEY);
  if (pts instanceof Y.Map) return pts;
  const created = new Y.Map<unknown>();
  entry.set(POINTS_KEY, created);
  return created;
}

function numberOr(value: unknown, fallback: number): number {
  return typeof value === 'number' && Number.isFinite(value) ? value : fallback;
}
