/**
 * Net numbering and the structural checks that need the whole graph: floating nets and loops of
 * ideal voltage sources. Unknowns are the non-ground nets in order of first use, then one branch
 * current per ideal voltage source and per inductor.
 */
import { type Element, GROUND, type NetName } from '../netlist';
import { NetlistError } from './errors';
import { GROUND_INDEX } from './stamp';

export interface Topology {
  /** Non-ground nets; position = unknown index. */
  readonly nodeNames: readonly NetName[];
  readonly nodeIndex: ReadonlyMap<NetName, number>;
  /** Branch-current unknown of each ideal voltage source and inductor, by element id. */
  readonly branchOf: ReadonlyMap<string, number>;
  readonly size: number;
  /** Human name of every unknown, for error messages. */
  readonly unknownNames: readonly string[];
}

/** Every net an element touches, inputs included. */
export function netsOf(el: Element): NetName[] {
  switch (el.kind) {
    case 'resistor':
    case 'capacitor':
    case 'inductor':
      return [el.a, el.b];
    case 'vsource':
      return [el.pos, el.neg];
    case 'isource':
      return [el.from, el.to];
    case 'diode':
      return [el.anode, el.cathode];
    case 'comparator':
      return [el.inP, el.inN, el.supply, el.gnd, el.out];
    case 'regulator':
      return el.pg !== undefined
        ? [el.input, el.en, el.out, el.gnd, el.pg]
        : [el.input, el.en, el.out, el.gnd];
    case 'supervisor':
      return [el.supply, el.gnd, el.out, ...el.monitors.map((m) => m.net)];
  }
}

/** Pairs of nets an element connects by a conducting path (inputs and current sources do not). */
function conductingPairs(el: Element): Array<[NetName, NetName]> {
  switch (el.kind) {
    case 'resistor':
    case 'capacitor':
    case 'inductor':
      return [[el.a, el.b]];
    case 'vsource':
      return [[el.pos, el.neg]];
    case 'diode':
      return [[el.anode, el.cathode]];
    case 'isource':
      return [];
    case 'comparator':
      return el.output === 'push-pull'
        ? [
            [el.out, el.gnd],
            [el.out, el.supply],
          ]
        : [[el.out, el.gnd]];
    case 'regulator':
      return el.pg !== undefined
        ? [
            [el.out, el.gnd],
            [el.pg, el.gnd],
          ]
        : [[el.out, el.gnd]];
    case 'supervisor':
      return [[el.out, el.gnd]];
  }
}

class UnionFind {
  private readonly parent = new Map<string, string>();

  find(a: string): string {
    let r = a;
    while (this.parent.has(r) && this.parent.get(r) !== r) r = this.parent.get(r) as string;
    this.parent.set(a, r);
    return r;
  }

  union(a: string, b: string): void {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra !== rb) this.parent.set(ra, rb);
  }
}

function checkFloating(elements: ReadonlyArray<Element>, nets: readonly NetName[]): void {
  const uf = new UnionFind();
  for (const el of elements) for (const [a, b] of conductingPairs(el)) uf.union(a, b);
  const ground = uf.find(GROUND);
  for (const net of nets) {
    if (uf.find(net) === ground) continue;
    const users = elements.filter((el) => netsOf(el).includes(net)).map((el) => el.id);
    throw new NetlistError(
      `net '${net}' is floating: no resistor, capacitor, inductor, diode, voltage source or part ` +
        `output connects it to ground '0' (it only touches ${users.join(', ')})`,
      { net },
    );
  }
}

function isIdealSource(el: Element): boolean {
  return el.kind === 'vsource' && (el.rs === undefined || el.rs === 0);
}

function checkSourceLoops(elements: ReadonlyArray<Element>): void {
  const adjacency = new Map<NetName, Array<{ net: NetName; id: string }>>();
  const link = (a: NetName, b: NetName, id: string): void => {
    if (!adjacency.has(a)) adjacency.set(a, []);
    adjacency.get(a)?.push({ net: b, id });
  };
  for (const el of elements) {
    if (el.kind !== 'vsource' || !isIdealSource(el)) continue;
    const path = pathBetween(adjacency, el.pos, el.neg);
    if (path !== null) {
      throw new NetlistError(
        `voltage source '${el.id}' closes a loop of ideal voltage sources (${[...path, el.id].join(', ')}); ` +
          'give one of them a series resistance rs',
        { element: el.id },
      );
    }
    link(el.pos, el.neg, el.id);
    link(el.neg, el.pos, el.id);
  }
}

/** Element ids along a path from `from` to `to`, or null (breadth-first). */
function pathBetween(
  adjacency: Map<NetName, Array<{ net: NetName; id: string }>>,
  from: NetName,
  to: NetName,
): string[] | null {
  const via = new Map<NetName, { prev: NetName; id: string } | null>([[from, null]]);
  const queue = [from];
  while (queue.length > 0) {
    const net = queue.shift() as NetName;
    if (net === to) {
      const ids: string[] = [];
      for (let step = via.get(net); step; step = via.get(step.prev)) ids.push(step.id);
      return ids.reverse();
    }
    for (const next of adjacency.get(net) ?? []) {
      if (via.has(next.net)) continue;
      via.set(next.net, { prev: net, id: next.id });
      queue.push(next.net);
    }
  }
  return null;
}

/** Numbers the unknowns and runs the graph checks; throws `NetlistError`. */
export function buildTopology(elements: ReadonlyArray<Element>): Topology {
  const nodeIndex = new Map<NetName, number>([[GROUND, GROUND_INDEX]]);
  const nodeNames: NetName[] = [];
  for (const el of elements) {
    for (const net of netsOf(el)) {
      if (nodeIndex.has(net)) continue;
      nodeIndex.set(net, nodeNames.length);
      nodeNames.push(net);
    }
  }
  if (!elements.some((el) => netsOf(el).includes(GROUND))) {
    throw new NetlistError("no element connects to ground net '0'", { net: GROUND });
  }
  checkFloating(elements, nodeNames);
  checkSourceLoops(elements);
  const branchOf = new Map<string, number>();
  const unknownNames = [...nodeNames];
  for (const el of elements) {
    if (isIdealSource(el) || el.kind === 'inductor') {
      branchOf.set(el.id, unknownNames.length);
      unknownNames.push(`current of ${el.id}`);
    }
  }
  return { nodeNames, nodeIndex, branchOf, size: unknownNames.length, unknownNames };
}
