import { describe, expect, it } from 'vitest';
import { PassThrough } from 'node:stream';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fitCommand } from '../../../src/cli/commands/fit';
import { dayToIsoDate } from '../../../src/lib/baseline/calendar-days';
import { syntheticSeries } from './support';

const dir = mkdtempSync(join(tmpdir(), 'plumbline-fit-'));

function writeInputs(): { bills: string; weather: string } {
  const a = syntheticSeries({ base: 50, heat: 3, tauH: 60, cool: 0, tauC: 70, noise: 0.02 }, 11);
  const b = syntheticSeries({ base: 80, heat: 0, tauH: 60, cool: 5, tauC: 68, noise: 0.02 }, 11); // same seed → same weather
  const weather = ['STATION,DATE,TMAX,TMIN,PRCP'];
  a.temps.meanF.forEach((t, i) => weather.push(`X,${dayToIsoDate(a.temps.firstDay + i)},${t + 6},${t - 6},0`));
  const bills = ['series,period_start,period_end,quantity'];
  for (const [id, s] of [['gas-1', a], ['elec-2', b]] as const) {
    for (let i = 0; i < s.bills.startDay.length; i++) bills.push(`${id},${dayToIsoDate(s.bills.startDay[i]!)},${dayToIsoDate(s.bills.endDay[i]!)},${s.bills.quantity[i]}`);
  }
  bills.push('tiny,2020-03-01,2020-03-31,10');
  const paths = { bills: join(dir, 'bills.csv'), weather: join(dir, 'weather.csv') };
  writeFileSync(paths.bills, `${bills.join('\n')}\n`);
  writeFileSync(paths.weather, `${weather.join('\n')}\n`);
  return paths;
}

async function run(argv: string[]): Promise<{ code: number; out: string; err: string }> {
  const out = new PassThrough();
  const err = new PassThrough();
  let o = '';
  let e = '';
  out.on('data', (c) => (o += c));
  err.on('data', (c) => (e += c));
  const code = await fitCommand(argv, out, err);
  return { code, out: o, err: e };
}

describe('plumbline fit (file-based CLI)', () => {
  const paths = writeInputs();

  it('prints the documented JSON: selected model fields, nulls where a field does not apply, a reason on failure', async () => {
    const r = await run(['--bills', paths.bills, '--weather', paths.weather, '--json', '--workers', '0']);
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out) as { series: Record<string, unknown>[] };
    expect(json.series.map((s) => s.id)).toEqual(['gas-1', 'elec-2', 'tiny']);
    const gas = json.series[0] as { ok: boolean; selected: Record<string, unknown>; nac: number };
    expect(gas.ok).toBe(true);
    expect(Object.keys(gas.selected)).toEqual(['shape', 'intercept', 'heatingSlope', 'coolingSlope', 'slope', 'heatingBalanceF', 'coolingBalanceF', 'n', 'r2', 'adjR2', 'cvrmse', 'nmbe']);
    expect(['heating', 'heating-cooling']).toContain(gas.selected.shape);
    expect(gas.selected.slope).toBeNull();
    expect(Math.abs((gas.selected.heatingBalanceF as number) - 60)).toBeLessThanOrEqual(2);
    expect(Math.abs((gas.selected.heatingSlope as number) - 3)).toBeLessThan(0.3);
    expect(gas.nac).toBeGreaterThan(0);
    expect(json.series[2]).toEqual({ id: 'tiny', ok: false, reason: 'too-few-periods', selected: null, nac: null });
  });

  it('--shapes restricts the shapes: without cooling, the heating-only series gets the heating shape and null cooling fields', async () => {
    const r = await run(['--bills', paths.bills, '--weather', paths.weather, '--json', '--workers', '0', '--shapes', 'mean,heating']);
    const gas = (JSON.parse(r.out) as { series: { selected: Record<string, unknown> }[] }).series[0]!;
    expect(gas.selected.shape).toBe('heating');
    expect(gas.selected.coolingSlope).toBeNull();
    expect(gas.selected.coolingBalanceF).toBeNull();
    const bad = await run(['--bills', paths.bills, '--weather', paths.weather, '--shapes', 'heating,sideways']);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/--shapes takes a comma list/);
  });

  it('gives the same output through the worker pool', async () => {
    const inProcess = await run(['--bills', paths.bills, '--weather', paths.weather, '--json', '--workers', '0']);
    const pooled = await run(['--bills', paths.bills, '--weather', paths.weather, '--json', '--workers', '2']);
    expect(pooled.out).toBe(inProcess.out);
  });

  it('prints a readable table without --json', async () => {
    const r = await run(['--bills', paths.bills, '--weather', paths.weather]);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^series\s+result\s+shape/);
    expect(r.out).toMatch(/gas-1\s+\S+\s+heating/);
    expect(r.out).toMatch(/tiny\s+too-few-periods/);
  });

  it('exits 2 with a clear message for a missing file, a missing column or a bad row', async () => {
    const missing = await run(['--bills', join(dir, 'nope.csv'), '--weather', paths.weather, '--json']);
    expect(missing.code).toBe(2);
    expect(missing.err).toMatch(/cannot read the bills file .*nope\.csv/);

    const noColumn = join(dir, 'no-column.csv');
    writeFileSync(noColumn, 'series,period_start,period_end\nA,2024-01-01,2024-01-31\n');
    const col = await run(['--bills', noColumn, '--weather', paths.weather]);
    expect(col.code).toBe(2);
    expect(col.err).toMatch(/no 'quantity' column/);

    const badRow = join(dir, 'bad-row.csv');
    writeFileSync(badRow, 'series,period_start,period_end,quantity\nA,2024-01-01,2024-01-31,12\nA,2024-02-30,2024-03-01,4\n');
    const bad = await run(['--bills', badRow, '--weather', paths.weather]);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/line 3: period_start '2024-02-30'/);

    const usage = await run(['--bills', paths.bills]);
    expect(usage.code).toBe(2);
    expect(usage.err).toMatch(/--weather are required/);
  });
});
