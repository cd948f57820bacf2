/**
 * `plumbline import <file> --installation <code> [--map field=Header,...] [--dry-run] [--json]`:
 * the same import as the Bill intake screen and POST /api/imports, printing the same report.
 */
import { readFileSync } from 'node:fs';
import { basename } from 'node:path';
import { withDatabase, parseArgs } from './db-session';

const USAGE = 'usage: plumbline import <file> --installation <code> [--map field=Header,...] [--dry-run] [--json]';

function parseMap(spec: string | undefined): Record<string, string> | undefined | string {
  if (!spec) return undefined;
  const out: Record<string, string> = {};
  for (const part of spec.split(',')) {
    const eq = part.indexOf('=');
    if (eq <= 0) return `--map: "${part}" is not field=Header`;
    out[part.slice(0, eq).trim()] = part.slice(eq + 1).trim();
  }
  return out;
}

export async function importCommand(argv: string[], out: NodeJS.WritableStream, err: NodeJS.WritableStream = process.stderr): Promise<number> {
  const { positional, options, flags } = parseArgs(argv, ['dry-run', 'json']);
  const file = positional[0];
  const code = options.installation;
  if (!file || !code) {
    err.write(`${USAGE}\n`);
    return 2;
  }
  let bytes: Uint8Array;
  try {
    bytes = new Uint8Array(readFileSync(file));
  } catch (e) {
    err.write(`cannot read ${file}: ${(e as Error).message}\n`);
    return 2;
  }
  const mapping = parseMap(options.map);
  if (typeof mapping === 'string') {
    err.write(`${mapping}\n${USAGE}\n`);
    return 2;
  }
  return withDatabase(err, async (actor) => {
    const { getDb } = await import('../../db/client');
    const { installationByCode } = await import('../../server/authz');
    const { importBills } = await import('../../server/imports/bills');
    const { HttpError } = await import('../../server/http');
    let inst;
    try {
      inst = await installationByCode(await getDb(), actor, code);
    } catch (e) {
      if (e instanceof HttpError) {
        err.write(`${e.message}\n`);
        return 2;
      }
      throw e;
    }
    const report = await importBills(actor, { installation: { id: inst.id, code: inst.code }, fileName: basename(file), bytes, mapping, dryRun: flags.has('dry-run') });
    if (flags.has('json')) out.write(`${JSON.stringify(report)}\n`);
    else {
      if (report.failure) out.write(`Refused: ${report.failure.message}\n`);
      const c = report.counts;
      out.write(`${report.dryRun ? 'Dry run (nothing stored)' : 'Committed'}: ${c.rows} rows, ${c.new} new, ${c.changed} changed, ${c.unchanged} unchanged, ${c.rejected} rejected, ${c.warnings} warnings. Import ${report.id}.\n`);
      for (const p of report.problems.slice(0, 200)) out.write(`  line ${p.row}${p.column ? ` [${p.column}]` : ''} ${p.severity} ${p.code}: ${p.message}\n`);
      if (report.problemCount > 200) out.write(`  … ${report.problemCount - 200} more (use --json)\n`);
    }
    return report.failure ? 1 : 0;
  });
}
