import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import { PlanError } from '@rampart/collab/engine/plan/plan-errors';

const demoPath = join(__dirname, '../../../collab/engine/examples/motor-drive.json');
const demo = (): Record<string, unknown> & { parts: Array<Record<string, unknown>> } =>
  JSON.parse(readFileSync(demoPath, 'utf8'));

function problemsOf(input: unknown): string[] {
  try {
    parsePlan(input);
  } catch (err) {
    if (err instanceof PlanError) return [...err.problems];
    throw err;
  }
  return [];
}

describe('parsePlan', () => {
  it('motor-drive example → a plan with 27 parts and no problems', () => {
    expect(parsePlan(demo()).parts).toHaveLength(27);
  });

  it('negative resistor → message naming the part index, id and field', () => {
    const p = demo();
    p.parts[1] = { ...p.parts[1], value: -5 };
    expect(problemsOf(p)).toEqual(['parts[1] (R1).value: resistor value (ohms) must be > 0']);
  });

  it('NaN capacitor value → "must be finite" naming C3', () => {
    const p = demo();
    const i = p.parts.findIndex((x) => x.id === 'C3');
    p.parts[i] = { ...p.parts[i], value: Number.NaN };
    expect(problemsOf(p).join('\n')).toMatch(/\(C3\)\.value: capacitor value \(farads\) must be/);
  });

  it('unknown net → names the part, pin and net', () => {
    const p = demo();
    p.parts[1] = { ...p.parts[1], b: 'nowhere' };
    expect(problemsOf(p)).toContain('part R1: pin b uses unknown net nowhere');
  });

  it('duplicate part id → names the id', () => {
    const p = demo();
    p.parts.push({ ...p.parts[1] });
    expect(problemsOf(p)).toContain('part R1: id used more than once');
  });

  it('net reached only through a capacitor → floating net error naming the net and parts', () => {
    const p = demo();
    (p.nets as Array<{ id: string }>).push({ id: 'island' });
    p.parts.push({ id: 'CX', kind: 'capacitor', a: 'island', b: '0', value: 1e-9 });
    expect(problemsOf(p)).toEqual([
      'net island: floating, no DC path to ground (touched only by CX)',
    ]);
  });

  it('two ideal sources in parallel → loop error naming the second source', () => {
    const p = demo();
    p.parts.push({ id: 'VX', kind: 'vsource', pos: 'vin', neg: '0', value: 5 });
    p.parts[0] = { ...p.parts[0], rs: 0 };
    expect(problemsOf(p)[0]).toMatch(
      /^part VX: closes a loop of ideal voltage sources between nets vin and 0/,
    );
  });

  it('tolerance on a field the part lacks → names the field and the valid ones', () => {
    const p = demo();
    const i = p.parts.findIndex((x) => x.id === 'U1');
    p.parts[i] = { ...p.parts[i], tolerances: { speed: { percent: 5 } } };
    expect(problemsOf(p)[0]).toMatch(
      /^part U1: tolerances\.speed is not a numeric field of a regulator/,
    );
  });

  it('requirement on an unknown threshold → names the requirement, signal and threshold', () => {
    const p = demo();
    const reqs = p.requirements as Array<Record<string, unknown>>;
    reqs[0] = { ...reqs[0], a: { signal: 'v5', level: 'bogus' } };
    expect(problemsOf(p)).toContain(
      'requirement 5v-before-3v3: signal v5 has no threshold named bogus',
    );
  });

  it('too many parts → error stating the limit', () => {
    const p = demo();
    for (let i = 0; i < 400; i++)
      p.parts.push({ id: `RX${i}`, kind: 'resistor', a: 'v5', b: '0', value: 1e6 });
    expect(problemsOf(p)[0]).toBe('plan has 427 parts; the limit is 400');
  });

  it('wrong schemaVersion → error naming the field and the supported version', () => {
    expect(problemsOf({ ...demo(), schemaVersion: 7 })).toEqual([
      'schemaVersion: schemaVersion must be 1',
    ]);
  });
});
