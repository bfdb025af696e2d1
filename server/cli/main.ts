/**
 * Command-line entry: `gaugeline <command> [args]`. Commands live in ./commands and
 * are looked up in a plain table so new ones are one line each.
 * Exit codes: 0 ok, 2 bad input (one line on stderr), 1 unexpected failure.
 */
import { CliInputError } from './cli-error.ts';

type Command = (args: string[]) => Promise<void>;

const commands: Record<string, () => Promise<{ run: Command }>> = {
  'net-area': () => import('./commands/net-area.ts'),
  'check-member': () => import('./commands/check-member.ts'),
  check: () => import('./commands/check.ts'),
};

async function main(argv: string[]): Promise<number> {
  const [name, ...args] = argv;
  const load = name ? commands[name] : undefined;
  if (!load) {
    process.stderr.write(`command: ${name ? `unknown command "${name}"` : 'missing'}; expected one of ${Object.keys(commands).join(', ')}\n`);
    return 2;
  }
  try {
    await (await load()).run(args);
    return 0;
  } catch (e) {
    if (e instanceof CliInputError) {
      process.stderr.write(`${e.message.replace(/\s*\n\s*/g, ' ')}\n`);
      return 2;
    }
    process.stderr.write(`internal error: ${(e as Error).stack ?? String(e)}\n`);
    return 1;
  }
}

process.exitCode = await main(process.argv.slice(2));
