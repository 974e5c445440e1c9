/**
 * The analysis layer's simulator: the `sim/` transient simulator with one compiled circuit per
 * topology, reused across corners and Monte Carlo runs (only values change between them).
 */
import type { Netlist, SimOptions, SimResult } from '../netlist';
import { compile, type CompiledCircuit } from '../sim/simulate';
import type { SimulateFn } from './plan-runner';

/** Element ids, kinds and nets: what must not change for a compiled circuit to be reused. */
function topologyKey(netlist: Netlist): string {
  return netlist.elements
    .map((el) => {
      const nets = Object.entries(el)
        .filter(([, v]) => typeof v === 'string')
        .map(([k, v]) => `${k}=${String(v)}`)
        .join(',');
      const rs = el.kind === 'vsource' ? `|rs0=${String(el.rs === undefined || el.rs === 0)}` : '';
      const monitors =
        el.kind === 'supervisor' ? `|m=${el.monitors.map((m) => m.net).join(',')}` : '';
      // Sources keep their waveform shape too, so breakpoints prepared at compile time still fit.
      const wave =
        el.kind === 'vsource' || el.kind === 'isource'
          ? `|w=${el.wave.kind}${el.wave.kind === 'pwl' ? el.wave.points.length : ''}`
          : '';
      return `${nets}${rs}${monitors}${wave}`;
    })
    .join(';');
}

/**
 * A `SimulateFn` that compiles each distinct topology once (at most `cacheSize` kept) and runs
 * the compiled form with the new values afterwards.
 */
export function createEngineSimulator(cacheSize = 16): SimulateFn {
  const cache = new Map<string, CompiledCircuit>();
  return (netlist: Netlist, options: SimOptions): SimResult => {
    const key = topologyKey(netlist);
    const hit = cache.get(key);
    if (hit !== undefined) return hit.run(options, netlist);
    const compiled = compile(netlist);
    if (cache.size >= cacheSize) cache.delete(cache.keys().next().value as string);
    cache.set(key, compiled);
    return compiled.run(options);
  };
}
