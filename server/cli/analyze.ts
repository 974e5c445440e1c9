/**
 * Command line: analyse a plan file and print the result JSON on stdout.
 *
 *   npm run -s analyze -- <plan.json> [--corners] [--monte-carlo N --seed S]
 *                         [--scenario NAME] [--csv OUT.csv] [--no-curves]
 *                         [--suggest PART [--series E6|E12|E24|E48|E96]]
 *
 * `--suggest` sweeps the part's value over the series (the decade centred on its nominal) with
 * a corner analysis per value and adds `suggestion` to the result.
 *
 * Errors go to stderr with exit code 1 (2 for bad arguments).
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { analyzePlan } from '@rampart/collab/engine/analysis/analyze-plan';
import { createEngineSimulator } from '@rampart/collab/engine/analysis/engine-simulator';
import type { AnalysisResult } from '@rampart/collab/engine/analysis/result-types';
import {
  suggestValues,
  type ValueSuggestion,
} from '@rampart/collab/engine/analysis/value-suggestion';
import type { ESeriesName } from '@rampart/collab/engine/models/e-series';
import { parsePlan } from '@rampart/collab/engine/plan/validate-plan';

export interface CliArgs {
  planPath: string;
  corners: boolean;
  monteCarlo?: { runs: number; seed: number };
  scenario?: string;
  csv?: string;
  curves: boolean;
  suggest?: { partId: string; series: ESeriesName };
}

export class UsageError extends Error {
  override readonly name = 'UsageError';
}

const USAGE =
  'usage: analyze <plan.json> [--corners] [--monte-carlo N --seed S] [--scenario NAME] [--csv OUT.csv] [--no-curves] [--suggest PART [--series E6|E12|E24|E48|E96]]';

const E_SERIES_NAMES: readonly ESeriesName[] = ['E6', 'E12', 'E24', 'E48', 'E96'];

function integerArg(flag: string, value: string | undefined): number {
  const n = Number(value);
  if (value === undefined || !Number.isInteger(n))
    throw new UsageError(`${flag} needs an integer, got ${String(value)}\n${USAGE}`);
  return n;
}

/** Parses the command-line arguments (after the script name). */
export function parseArgs(argv: readonly string[]): CliArgs {
  let planPath: string | undefined;
  const args: Omit<CliArgs, 'planPath'> = { corners: false, curves: true };
  let runs: number | undefined;
  let seed: number | undefined;
  let suggest: string | undefined;
  let series: string | undefined;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--corners') args.corners = true;
    else if (a === '--no-curves') args.curves = false;
    else if (a === '--monte-carlo') runs = integerArg(a, argv[++i]);
    else if (a === '--seed') seed = integerArg(a, argv[++i]);
    else if (a === '--scenario') args.scenario = argv[++i];
    else if (a === '--csv') args.csv = argv[++i];
    else if (a === '--suggest') suggest = argv[++i];
    else if (a === '--series') series = argv[++i];
    else if (a.startsWith('--')) throw new UsageError(`unknown option ${a}\n${USAGE}`);
    else if (planPath === undefined) planPath = a;
    else throw new UsageError(`unexpected argument ${a}\n${USAGE}`);
  }
  if (planPath === undefined) throw new UsageError(`missing plan file\n${USAGE}`);
  if (seed !== undefined && runs === undefined)
    throw new UsageError(`--seed needs --monte-carlo N\n${USAGE}`);
  if (runs !== undefined) args.monteCarlo = { runs, seed: seed ?? 1 };
  if (series !== undefined && suggest === undefined)
    throw new UsageError(`--series needs --suggest PART\n${USAGE}`);
  if (series !== undefined && !(E_SERIES_NAMES as readonly string[]).includes(series))
    throw new UsageError(`--series must be one of ${E_SERIES_NAMES.join(', ')}\n${USAGE}`);
  if (suggest !== undefined)
    args.suggest = { partId: suggest, series: (series ?? 'E24') as ESeriesName };
  if (
    (args.scenario === undefined && argv.includes('--scenario')) ||
    (args.csv === undefined && argv.includes('--csv')) ||
    (suggest === undefined && argv.includes('--suggest'))
  ) {
    throw new UsageError(`--scenario, --csv and --suggest need a value\n${USAGE}`);
  }
  return { planPath, ...args };
}

/** Long-format CSV of the nominal curves: scenario, temperature, time, one column per signal. */
export function curvesCsv(result: AnalysisResult): string {
  const signals = result.cases[0]?.curves.map((c) => c.signal) ?? [];
  const lines = [['scenario', 'temperature_C', 'time_s', ...signals].join(',')];
  for (const c of result.cases) {
    c.time.forEach((t, i) => {
      lines.push(
        [c.scenarioId, c.temperature, t, ...c.curves.map((curve) => curve.nominal[i])].join(','),
      );
    });
  }
  return `${lines.join('\n')}\n`;
}

/** Runs the command; returns the exit code. */
export function main(
  argv: readonly string[],
  out: (s: string) => void,
  err: (s: string) => void,
): number {
  let args: CliArgs;
  try {
    args = parseArgs(argv);
  } catch (e) {
    err(`${e instanceof Error ? e.message : String(e)}\n`);
    return 2;
  }
  try {
    let raw: unknown;
    try {
      raw = JSON.parse(readFileSync(args.planPath, 'utf8'));
    } catch (e) {
      throw new Error(
        `cannot read plan ${args.planPath}: ${e instanceof Error ? e.message : String(e)}`,
      );
    }
    const plan = parsePlan(raw);
    const simulate = createEngineSimulator();
    const result: AnalysisResult & { suggestion?: ValueSuggestion } = analyzePlan(plan, {
      simulate,
      corners: args.corners,
      scenario: args.scenario,
      ...(args.monteCarlo === undefined ? {} : { monteCarlo: args.monteCarlo }),
    });
    if (args.suggest !== undefined)
      result.suggestion = suggestValues(plan, args.suggest.partId, args.suggest.series, simulate);
    if (args.csv !== undefined) writeFileSync(args.csv, curvesCsv(result));
    const printed: AnalysisResult = args.curves
      ? result
      : { ...result, cases: result.cases.map((c) => ({ ...c, time: [], curves: [] })) };
    out(`${JSON.stringify(printed)}\n`);
    return 0;
  } catch (e) {
    err(`${e instanceof Error ? `${e.name}: ${e.message}` : String(e)}\n`);
    return 1;
  }
}

if (require.main === module) {
  process.exitCode = main(
    process.argv.slice(2),
    (s) => process.stdout.write(s),
    (s) => process.stderr.write(s),
  );
}
