/** Builds the element model (strategy) for each netlist element, wired to its unknowns. */
import type { Element } from '../netlist';
import { CapacitorModel } from './elements/capacitor';
import { ComparatorModel } from './elements/comparator';
import { CurrentSourceModel } from './elements/current-source';
import { DiodeModel } from './elements/diode';
import { InductorModel } from './elements/inductor';
import { RegulatorModel } from './elements/regulator';
import { ResistorModel } from './elements/resistor';
import { SupervisorModel } from './elements/supervisor';
import { VoltageSourceModel } from './elements/voltage-source';
import type { ElementModel } from './stamp';
import type { Topology } from './topology';

export function buildModel(el: Element, topo: Topology): ElementModel {
  // Models address ground as the extra slot `size` (see MnaSystem).
  const n = (net: string): number => {
    const i = topo.nodeIndex.get(net) as number;
    return i < 0 ? topo.size : i;
  };
  const branch = topo.branchOf.get(el.id) ?? -1;
  switch (el.kind) {
    case 'resistor':
      return new ResistorModel(el.id, n(el.a), n(el.b));
    case 'capacitor':
      return new CapacitorModel(el.id, n(el.a), n(el.b));
    case 'inductor':
      return new InductorModel(el.id, n(el.a), n(el.b), branch);
    case 'vsource':
      return new VoltageSourceModel(el.id, n(el.pos), n(el.neg), branch);
    case 'isource':
      return new CurrentSourceModel(el.id, n(el.from), n(el.to));
    case 'diode':
      return new DiodeModel(el.id, n(el.anode), n(el.cathode));
    case 'comparator':
      return new ComparatorModel(el.id, n(el.inP), n(el.inN), n(el.supply), n(el.gnd), n(el.out));
    case 'regulator':
      return new RegulatorModel(
        el.id,
        n(el.input),
        n(el.en),
        n(el.out),
        n(el.gnd),
        el.pg !== undefined ? n(el.pg) : -1,
        el.pg !== undefined,
      );
    case 'supervisor':
      return new SupervisorModel(
        el.id,
        n(el.supply),
        n(el.gnd),
        n(el.out),
        Int32Array.from(el.monitors, (m) => n(m.net)),
      );
  }
}
