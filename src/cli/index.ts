/**
 * Plumbline command line: `npm run plumbline -- <command> [args]` (tsx src/cli/index.ts).
 * Commands work on files, without the database.
 */
import { fitCommand } from './commands/fit';

const commands: Record<string, { run: (argv: string[], out: NodeJS.WritableStream) => Promise<number>; help: string }> = {
  fit: { run: fitCommand, help: 'fit --bills <csv> --weather <csv> [--json] [--workers N]   weather-normalized baselines from files' },
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
