import { readFile } from 'node:fs/promises';
import type { z } from 'zod';
import { CliInputError } from './cli-error.ts';
import { formatIssue } from '../../shared/engine/schemas.ts';

/** Read a JSON file and validate it; every failure becomes a one-line CliInputError. */
export async function readJsonInput<T extends z.ZodType>(path: string | undefined, schema: T, what: string): Promise<z.output<T>> {
  if (!path) throw new CliInputError(`${what}: missing file argument`);
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new CliInputError(`${path}: cannot read file (${code === 'ENOENT' ? 'no such file' : code ?? 'error'})`);
  }
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new CliInputError(`${path}: not valid JSON (${(e as Error).message.split('\n')[0]})`);
  }
  const parsed = schema.safeParse(data);
  if (!parsed.success) throw new CliInputError(formatIssue(parsed.error.issues[0]));
  return parsed.data;
}
