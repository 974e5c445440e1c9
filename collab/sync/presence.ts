/**
 * What one client shares about itself while a plan is open (its y-protocols awareness state).
 * The server validates every state before relaying it, so other clients can trust the shape.
 */

/** Kinds of plan item a selection can point at. */
export const SELECTION_KINDS = [
  'signal',
  'part',
  'net',
  'requirement',
  'scenario',
  'intent',
] as const;

export type SelectionKind = (typeof SELECTION_KINDS)[number];

export interface Presence {
  user: {
    id: string;
    name: string;
    /** `#rrggbb`, chosen by the client. */
    colour: string;
  };
  /** Time under the user's cursor on the timing view, seconds. */
  cursorTime?: number;
  selection?: Array<{ kind: SelectionKind; id: string }>;
  /** Visible time window, seconds, `t0 < t1`. */
  viewport?: { t0: number; t1: number };
}

/** Longest user name, item id, and selection list accepted in a presence state. */
export const PRESENCE_LIMITS = { name: 120, id: 120, selection: 200 } as const;

const COLOUR = /^#[0-9a-fA-F]{6}$/;

/** Why a presence state was refused, naming the field. */
export type PresenceCheck =
  { ok: true; presence: Presence } | { ok: false; field: string; reason: string };

function isRecord(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function isShortString(v: unknown, max: number): v is string {
  return typeof v === 'string' && v.length > 0 && v.length <= max;
}

/** Checks an awareness state received from the wire. Unknown extra keys are refused. */
export function validatePresence(value: unknown): PresenceCheck {
  const fail = (field: string, reason: string): PresenceCheck => ({ ok: false, field, reason });
  if (!isRecord(value)) return fail('presence', 'must be an object');
  const allowed = new Set(['user', 'cursorTime', 'selection', 'viewport']);
  for (const key of Object.keys(value)) {
    if (!allowed.has(key)) return fail(key, 'is not a presence field');
  }
  const user = value['user'];
  if (!isRecord(user)) return fail('user', 'must be an object');
  if (!isShortString(user['id'], PRESENCE_LIMITS.id))
    return fail('user.id', 'must be a short string');
  if (!isShortString(user['name'], PRESENCE_LIMITS.name)) {
    return fail('user.name', 'must be a short string');
  }
  if (typeof user['colour'] !== 'string' || !COLOUR.test(user['colour'])) {
    return fail('user.colour', 'must be #rrggbb');
  }
  if (Object.keys(user).length !== 3) return fail('user', 'must hold only id, name and colour');
  const cursorTime = value['cursorTime'];
  if (
    cursorTime !== undefined &&
    !(typeof cursorTime === 'number' && Number.isFinite(cursorTime))
  ) {
    return fail('cursorTime', 'must be a finite number');
  }
  const selection = value['selection'];
  if (selection !== undefined) {
    if (!Array.isArray(selection) || selection.length > PRESENCE_LIMITS.selection) {
      return fail('selection', `must be a list of at most ${PRESENCE_LIMITS.selection} items`);
    }
    for (const [i, item] of selection.entries()) {
      if (!isRecord(item) || !(SELECTION_KINDS as readonly unknown[]).includes(item['kind'])) {
        return fail(`selection[${i}].kind`, `must be one of ${SELECTION_KINDS.join(', ')}`);
      }
      if (!isShortString(item['id'], PRESENCE_LIMITS.id)) {
        return fail(`selection[${i}].id`, 'must be a short string');
      }
    }
  }
  const viewport = value['viewport'];
  if (viewport !== undefined) {
    if (!isRecord(viewport)) return fail('viewport', 'must be an object');
    const { t0, t1 } = viewport;
    if (
      typeof t0 !== 'number' ||
      typeof t1 !== 'number' ||
      !Number.isFinite(t0) ||
      !Number.isFinite(t1)
    ) {
      return fail('viewport', 't0 and t1 must be finite numbers');
    }
    if (!(t0 < t1)) return fail('viewport', 't0 must be below t1');
  }
  return { ok: true, presence: value as unknown as Presence };
}
