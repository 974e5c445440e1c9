/** Network checks that need the whole plan: floating nets and loops of ideal voltage sources. */
import { GROUND } from '../netlist';
import type { PartSpec } from './plan-schema-parts';
import { dcPaths, idealShorts, partPins } from './part-pins';

/** Minimal union-find over net names. */
class NetSets {
  private readonly parent = new Map<string, string>();

  find(net: string): string {
    let root = net;
    while (this.parent.has(root) && this.parent.get(root) !== root)
      root = this.parent.get(root) ?? root;
    this.parent.set(net, root);
    return root;
  }

  /** Joins two sets; returns false when they were already joined. */
  union(a: string, b: string): boolean {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra === rb) return false;
    this.parent.set(ra, rb);
    return true;
  }
}

/**
 * Problems of the network's structure, one message each, naming the net or parts.
 * A net without a DC path to ground makes the operating point undefined (only capacitors or
 * high-impedance inputs touch it); a loop of ideal voltage sources makes the MNA matrix singular.
 */
export function topologyProblems(parts: readonly PartSpec[]): string[] {
  const problems: string[] = [];
  const dc = new NetSets();
  const shorts = new NetSets();
  const used = new Map<string, string[]>();
  for (const part of parts) {
    for (const { net } of partPins(part)) {
      const list = used.get(net) ?? [];
      if (!list.includes(part.id)) list.push(part.id);
      used.set(net, list);
    }
    for (const [a, b] of dcPaths(part)) dc.union(a, b);
    for (const [a, b] of idealShorts(part)) {
      if (a === b) problems.push(`part ${part.id}: voltage source connects net ${a} to itself`);
      else if (!shorts.union(a, b)) {
        problems.push(
          `part ${part.id}: closes a loop of ideal voltage sources between nets ${a} and ${b} (give one a series resistance rs)`,
        );
      }
    }
  }
  const groundRoot = dc.find(GROUND);
  for (const [net, partIds] of used) {
    if (net === GROUND) continue;
    if (dc.find(net) !== groundRoot) {
      problems.push(
        `net ${net}: floating, no DC path to ground (touched only by ${partIds.join(', ')})`,
      );
    }
  }
  return problems;
}
