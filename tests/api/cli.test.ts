/** The command line: import and weather on a stopped demo folder, and refused while a server holds it. */
import { spawnSync } from 'node:child_process';
import { cpSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, inject, it } from 'vitest';
import { ROOT, serverEnv } from '../support/server-process';

const template = inject('demoTemplateDir');
const running = inject('serverDataDir');

function cli(dataDir: string, ...args: string[]) {
  return spawnSync(process.execPath, ['--import', 'tsx', join(ROOT, 'src', 'cli', 'index.ts'), ...args], {
    cwd: ROOT,
    env: serverEnv({ PLUMBLINE_DATA_DIR: dataDir }),
    encoding: 'utf8',
    timeout: 120_000,
  });
}

describe.skipIf(!template)('plumbline import / weather', () => {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-cli-'));
  const csv = join(dir, 'bills.csv');
  writeFileSync(csv, 'Meter,From,To,kWh\nBNP-3134-E,2021-05-04,2021-06-02,30100\nBNP-3134-E,2021-06-03,2021-07-02,\n');

  it('dry run prints the report and stores nothing; the commit stores the valid row', () => {
    cpSync(template, join(dir, 'db'), { recursive: true, filter: (p) => !p.endsWith('ready') && !p.endsWith('plumbline.lock') });
    const dry = cli(join(dir, 'db'), 'import', csv, '--installation', 'BNP', '--map', 'meter=Meter,periodStart=From,periodEnd=To,quantity=kWh', '--dry-run', '--json');
    expect(dry.status, dry.stderr).toBe(0);
    const report = JSON.parse(dry.stdout);
    expect(report).toMatchObject({ dryRun: true, counts: { rows: 2, new: 1, rejected: 1 } });
    expect(report.problems).toContainEqual(expect.objectContaining({ row: 3, column: 'kWh', code: 'missing-value', severity: 'error' }));
    const commit = cli(join(dir, 'db'), 'import', csv, '--installation', 'BNP', '--map', 'meter=Meter,periodStart=From,periodEnd=To,quantity=kWh');
    expect(commit.status).toBe(0);
    expect(commit.stdout).toMatch(/^Committed: 2 rows, 1 new, 0 changed, 0 unchanged, 1 rejected/);
    const again = cli(join(dir, 'db'), 'import', csv, '--installation', 'BNP', '--map', 'meter=Meter,periodStart=From,periodEnd=To,quantity=kWh', '--json');
    expect(JSON.parse(again.stdout).counts).toMatchObject({ new: 0, unchanged: 1 });
  });

  it('loads a weather file into a station', () => {
    const w = join(dir, 'w.csv');
    writeFileSync(w, 'STATION,DATE,TMAX,TMIN\n,1990-01-01,40,20\n,1990-01-02,38,21\n');
    const r = cli(join(dir, 'db'), 'weather', w, '--station', 'BNPWX', '--units', 'standard');
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/Station BNPWX: 2 days read, 2 added/);
  });

  it('user add creates an account, sends the welcome mail and prints its link; a bad role is refused', () => {
    const ok = cli(join(dir, 'db'), 'user', 'add', '--email', 'new.lead@example.test', '--name', 'New Lead', '--role', 'admin');
    expect(ok.status, ok.stderr).toBe(0);
    expect(ok.stdout).toMatch(/^Created admin new\.lead@example\.test/);
    expect(ok.stdout).toMatch(/https?:\/\/\S+/);
    const again = cli(join(dir, 'db'), 'user', 'add', '--email', 'new.lead@example.test', '--name', 'New Lead', '--role', 'admin');
    expect(again.status).toBe(2);
    expect(again.stderr).toMatch(/already/i);
    const bad = cli(join(dir, 'db'), 'user', 'add', '--email', 'x@example.test', '--name', 'X', '--role', 'wizard');
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/role/);
  });

  it('bad arguments get the usage line and exit code 2', () => {
    const r = cli(join(dir, 'db'), 'import', csv);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/usage: plumbline import/);
  });
});

describe.skipIf(!running)('while a server holds the data folder', () => {
  it('the command refuses with a clear message', () => {
    const r = cli(running, 'import', join(ROOT, 'tests/fixtures/imports/messy-bills.csv'), '--installation', 'BNP');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/Another Plumbline process .* is using the data folder/);
    expect(r.stderr).toMatch(/use the API instead/);
  });
});
