import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { main, parseArgs } from '../../../server/cli/analyze';
import { createEngineSimulator } from '@rampart/collab/engine/analysis/engine-simulator';
import type { AnalysisResult } from '@rampart/collab/engine/analysis/result-types';
import {
  suggestValues,
  type ValueSuggestion,
} from '@rampart/collab/engine/analysis/value-suggestion';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';
import { rcDelayPlanJson } from './rc-delay-plan';

const demo = join(__dirname, '../../../collab/engine/examples/motor-drive.json');

function run(argv: string[]): { code: number; out: string; err: string } {
  let out = '';
  let err = '';
  const code = main(
    argv,
    (s) => (out += s),
    (s) => (err += s),
  );
  return { code, out, err };
}

describe('analyze CLI', () => {
  it('demo plan --scenario power-up --corners → exit 0, finite margins and a worst corner per requirement', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rampart-cli-'));
    const csv = join(dir, 'curves.csv');
    const r = run([demo, '--scenario', 'power-up', '--corners', '--csv', csv]);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const result = JSON.parse(r.out) as AnalysisResult;
    expect(result.cases.map((c) => c.temperature)).toEqual([-55, 25, 125]);
    const reqIds = result.cases[0].requirements.map((m) => m.requirementId);
    expect(reqIds).toHaveLength(11);
    for (const m of result.cases.flatMap((c) => c.requirements)) {
      expect(Number.isFinite(m.margin)).toBe(true);
      expect(Number.isFinite(m.relativeMargin)).toBe(true);
    }
    expect(result.worstCase?.map((w) => w.requirementId)).toEqual(reqIds);
    for (const w of result.worstCase ?? []) {
      expect(Number.isFinite(w.worst?.margin)).toBe(true);
      expect(w.cornerLabel).toMatch(/^power-up: .*°C$/);
    }
    const delay = result.worstCase?.find((w) => w.requirementId === 'en33-rc-delay');
    // The RC delay (R4·C3) is shortest at C3 low and R4 low: its binding limit is the 1.5 ms minimum.
    expect(delay?.cornerLabel).toMatch(/R4 −1.99 %.*C3 −23.5 %/);
    expect(result.closedForm.length).toBeGreaterThan(0);
    for (const c of result.closedForm)
      expect(Math.abs(c.relativeDifference ?? 1)).toBeLessThan(1e-3);
    const lines = readFileSync(csv, 'utf8').trim().split('\n');
    expect(lines[0]).toBe(
      'scenario,temperature_C,time_s,vin,v5,pg5,en33,v33,pg33,v12,rst_n,vref,vth,en_drv',
    );
    expect(lines).toHaveLength(1 + 3 * 2000);
  }, 120_000);

  it('--monte-carlo 20 --seed 3 twice → identical summaries with yields in [0, 1]', () => {
    const a = run([
      demo,
      '--scenario',
      'power-up',
      '--monte-carlo',
      '20',
      '--seed',
      '3',
      '--no-curves',
    ]);
    const b = run([
      demo,
      '--scenario',
      'power-up',
      '--monte-carlo',
      '20',
      '--seed',
      '3',
      '--no-curves',
    ]);
    expect(a.code).toBe(0);
    const mc = (JSON.parse(a.out) as AnalysisResult).monteCarlo;
    expect(mc?.runs).toBe(20);
    expect(mc).toEqual((JSON.parse(b.out) as AnalysisResult).monteCarlo);
    for (const r of mc?.requirements ?? []) {
      expect(r.yieldPass).toBeGreaterThanOrEqual(0);
      expect(r.yieldPass).toBeLessThanOrEqual(1);
    }
  }, 120_000);

  it('plan with a negative resistor → exit 1, stderr names the part and field, nothing on stdout', () => {
    const dir = mkdtempSync(join(tmpdir(), 'rampart-cli-'));
    const bad = JSON.parse(readFileSync(demo, 'utf8')) as { parts: Array<Record<string, unknown>> };
    bad.parts[1].value = -1;
    const path = join(dir, 'bad.json');
    writeFileSync(path, JSON.stringify(bad));
    const r = run([path]);
    expect(r.code).toBe(1);
    expect(r.out).toBe('');
    expect(r.err).toMatch(
      /PlanError: parts\[1\] \(R1\)\.value: resistor value \(ohms\) must be > 0/,
    );
  });

  it('--monte-carlo 200000 → exit 1 with the stated 100 000-run limit', () => {
    const r = run([demo, '--monte-carlo', '200000']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/1 to 100000, got 200000/);
  });

  it('parseArgs(--seed without --monte-carlo) → usage error', () => {
    expect(() => parseArgs(['p.json', '--seed', '4'])).toThrow(/--seed needs --monte-carlo N/);
  });

  it('missing file → exit 1 naming the path', () => {
    const r = run(['no-such-plan.json']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/cannot read plan no-such-plan.json/);
  });

  it('--suggest C1 --series E6 → the suggestion of the engine, for the E6 values of the decade around 100 nF', () => {
    // An RC delay fed by the input ramp: R1 10 k ±1 %, C1 100 nF ±10 % X7R, at 25 °C only.
    const raw = rcDelayPlanJson([25]);
    const file = join(mkdtempSync(join(tmpdir(), 'rampart-cli-')), 'rc.json');
    writeFileSync(file, JSON.stringify(raw));
    const r = run([file, '--no-curves', '--suggest', 'C1', '--series', 'E6']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    const { suggestion } = JSON.parse(r.out) as { suggestion: ValueSuggestion };
    // IEC 60063 E6 mantissas 1.0 1.5 2.2 3.3 4.7 6.8, between 100 nF/√10 and 100 nF·√10.
    expect(suggestion.candidates.map((c) => c.value)).toEqual([
      33e-9, 47e-9, 68e-9, 100e-9, 150e-9, 220e-9,
    ]);
    const direct = suggestValues(parsePlan(raw), 'C1', 'E6', createEngineSimulator());
    expect(suggestion).toEqual(JSON.parse(JSON.stringify(direct)));
    // Larger C, longer delay, less margin to the 2 ms maximum: some but not all values fit.
    expect(suggestion.suitable.length).toBeGreaterThan(0);
    expect(suggestion.suitable.length).toBeLessThan(6);
    expect(suggestion.suitable[0]).toBe(33e-9);
  });

  it('--series E7, --series without --suggest, --suggest of a missing part → clear errors', () => {
    expect(() => parseArgs(['p.json', '--suggest', 'R4', '--series', 'E7'])).toThrow(
      /--series must be one of E6, E12, E24, E48, E96/,
    );
    expect(() => parseArgs(['p.json', '--series', 'E6'])).toThrow(/--series needs --suggest/);
    expect(() => parseArgs(['p.json', '--suggest'])).toThrow(/need a value/);
    expect(parseArgs(['p.json', '--suggest', 'R4']).suggest).toEqual({
      partId: 'R4',
      series: 'E24',
    });
    const r = run([demo, '--scenario', 'power-up', '--no-curves', '--suggest', 'R99']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/part R99: not in the plan/);
    expect(r.out).toBe('');
  }, 60_000);
});
