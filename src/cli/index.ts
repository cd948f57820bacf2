/**
 * Plumbline command line: `npm run plumbline -- <command> [args]` (tsx src/cli/index.ts).
 * `fit` works on files alone; `import` and `weather` open the database (stop the server first
 * when it runs on the embedded database: one process at a time).
 */
import { backupCommand, restoreCommand } from './commands/backup';
import { fitCommand } from './commands/fit';
import { importCommand } from './commands/import';
import { userCommand } from './commands/user';
import { weatherCommand } from './commands/weather';

const commands: Record<string, { run: (argv: string[], out: NodeJS.WritableStream) => Promise<number>; help: string }> = {
  fit: { run: fitCommand, help: 'fit --bills <csv> --weather <csv> [--json] [--workers N]   weather-normalized baselines from files' },
  import: { run: importCommand, help: 'import <file> --installation <code> [--map field=Header,...] [--dry-run] [--json]   bills into the database' },
  backup: { run: backupCommand, help: 'backup <file.tar.gz> [--json]   database, files and secret (the running server takes it, or this command when it is stopped)' },
  restore: { run: restoreCommand, help: 'restore <file.tar.gz> [--force] [--json]   into the stopped data folder, or the DATABASE_URL database' },
  user: { run: userCommand, help: 'user add --email <address> --name <name> --role <role> [--installations A,B]   an account (e.g. the first admin)' },
  weather: { run: weatherCommand, help: 'weather <file> --station <code> [--units standard|metric] [--json]   daily temperatures into the database' },
};

async function main(argv: string[]): Promise<number> {
  const [name, ...rest] = argv;
  const command = name === undefined ? undefined : commands[name];
  if (command === undefined) {
    const list = Object.values(commands).map((c) => `  ${c.help}`).join('\n');
    process.stderr.write(`${name === undefined || name === '--help' ? '' : `unknown command '${name}'\n`}usage: plumbline <command>\n${list}\n`);
    return name === undefined || name === '--help' ? 0 : 2;
  }
  return command.run(rest, process.stdout);
}

process.exitCode = await main(process.argv.slice(2));
