/**
 * Plans for the document-model tests: the demo board from the engine's examples, and a small
 * own fixture that uses every collection (scenarios, settings, nested tolerances, thresholds).
 * Values are demo data, not a real design.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';

import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import type { Plan } from '@rampart/collab/engine/plan/plan-schema';
import type { IntentTable } from '@rampart/collab/doc/drawn-intent';

/** The motor-drive demo plan, validated by the engine. */
export function motorDrivePlan(): Plan {
  const file = path.resolve(__dirname, '../../../collab/engine/examples/motor-drive.json');
  return parsePlan(JSON.parse(readFileSync(file, 'utf8')));
}

/** A small board: 5 V buck feeding a delayed 3.3 V LDO. */
export function smallPlan(): Plan {
  return parsePlan({
    schemaVersion: 1,
    name: 'Small motor-drive slice',
    description: '24 V → 5 V buck → RC-delayed 3.3 V LDO',
    nets: [{ id: 'vin' }, { id: 'v5', label: '5 V rail' }, { id: 'en33' }, { id: 'v33' }],
    parts: [
      { id: 'VIN', kind: 'vsource', role: 'input', pos: 'vin', neg: '0', value: 24 },
      {
        id: 'U1',
        kind: 'regulator',
        input: 'vin',
        en: 'vin',
        out: 'v5',
        gnd: '0',
        vout: 5,
        enOn: 1.2,
        enOff: 1.1,
        uvlo: 4.5,
        softStart: 0.002,
        dropout: 0.5,
        rout: 0.02,
        tolerances: { softStart: { percent: 20 }, vout: { percent: 2 } },
      },
      { id: 'RL5', kind: 'resistor', a: 'v5', b: '0', value: 51 },
      {
        id: 'R4',
        kind: 'resistor',
        a: 'v5',
        b: 'en33',
        value: 100000,
        tolerance: { percent: 1 },
        temperature: { kind: 'tempco', ppmPerC: 100 },
      },
      {
        id: 'C3',
        kind: 'capacitor',
        a: 'en33',
        b: '0',
        value: 1e-7,
        tolerance: { percent: 10, distribution: { kind: 'normal' } },
        temperature: { kind: 'dielectric', class: 'X7R' },
      },
      {
        id: 'U2',
        kind: 'regulator',
        input: 'v5',
        en: 'en33',
        out: 'v33',
        gnd: '0',
        vout: 3.3,
        enOn: 1.2,
        enOff: 1.0,
        uvlo: 2.5,
        softStart: 0.0005,
        dropout: 0.25,
        rout: 0.05,
      },
      { id: 'RL33', kind: 'resistor', a: 'v33', b: '0', value: 33 },
    ],
    signals: [
      { id: 'v5', kind: 'rail', net: 'v5', nominal: 5, thresholds: { 'in-regulation': 4.6 } },
      { id: 'en33', kind: 'enable', net: 'en33', nominal: 5, thresholds: { on: 1.2 } },
      { id: 'v33', kind: 'rail', net: 'v33', nominal: 3.3, thresholds: { start: 0.3 } },
    ],
    requirements: [
      {
        id: '5v-before-3v3',
        kind: 'order',
        a: { signal: 'v5', level: 'in-regulation' },
        b: { signal: 'v33', level: 'start' },
        minGap: 0.0005,
      },
      { id: 'v33-settles', kind: 'settle', signal: 'v33', band: 0.1, by: 0.02, targetMargin: 0.2 },
    ],
    scenarios: [
      { id: 'up', kind: 'power-up', temperatures: [-40, 25, 85] },
      { id: 'dip', kind: 'brown-out', dipLevel: 0.4, dipWidth: 0.002 },
    ],
    settings: { targetMargin: 0.25, duration: 0.03 },
  });
}

/** Drawn intents for the small plan (demo values). */
export function smallIntents(): IntentTable {
  return {
    v5: { start: 0.001, end: 0.003, level: 5, points: [{ id: 'knee', t: 0.0025, v: 4.8 }] },
    v33: { start: 0.005, end: 0.0055, level: 3.3, points: [] },
  };
}
