/**
 * Options of `gaugeline check`. Every mistake becomes one CliInputError line (exit 2),
 * naming the option and what was expected.
 */
import { STANDARDS, type StandardId } from '../../shared/api/projects.ts';
import { CliInputError } from './cli-error.ts';

export const CHECK_FORMATS = ['json', 'csv', 'xlsx', 'pdf', 'bcf', 'ifc'] as const;
export type CheckFormat = (typeof CHECK_FORMATS)[number];

/** Formats that are not text: they go to a file, never to the terminal. */
const NEEDS_OUT: CheckFormat[] = ['xlsx', 'pdf', 'bcf', 'ifc'];

export interface CheckOptions {
  model: string;
  standard: StandardId;
  forces: string | null;
  grade: string;
  format: CheckFormat;
  out: string | null;
  timeLimitSeconds: number;
  /** List every steel candidate, not only tension members. */
  all: boolean;
}

export const CHECK_USAGE =
  'usage: gaugeline check MODEL.ifc [--standard as4100|aisc360-lrfd|aisc360-asd|en1993] [--forces FORCES.csv] [--grade GRADE] [--format json|csv|xlsx|pdf|bcf|ifc] [--out FILE] [--time-limit SECONDS] [--all]';

/** The grade used where a member's material is not a grade Gaugeline knows (as a new project's default). */
const DEFAULT_GRADE: Record<StandardId, string> = { as4100: 'AS/NZS 3679.1-300', 'aisc360-lrfd': 'ASTM A36', 'aisc360-asd': 'ASTM A36', en1993: 'S355' };

export function parseCheckOptions(args: string[]): CheckOptions {
  const values: Record<string, string> = {};
  const positional: string[] = [];
  let all = false;
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a === '--all') {
      all = true;
      continue;
    }
    if (a.startsWith('--')) {
      const [key, inline] = a.slice(2).split(/=(.*)/s, 2);
      if (!['standard', 'forces', 'grade', 'format', 'out', 'time-limit'].includes(key)) throw new CliInputError(`unknown option --${key}; ${CHECK_USAGE}`);
      const value = inline ?? args[++i];
      if (value === undefined || value === '') throw new CliInputError(`--${key}: missing value`);
      values[key] = value;
    } else if (a.startsWith('-') && a !== '-') {
      throw new CliInputError(`unknown option ${a}; ${CHECK_USAGE}`);
    } else positional.push(a);
  }
  if (positional.length !== 1) throw new CliInputError(positional.length ? `expected one model file, got ${positional.length}; ${CHECK_USAGE}` : `MODEL: missing file argument; ${CHECK_USAGE}`);

  const standard = (values.standard ?? 'as4100') as StandardId;
  if (!STANDARDS.includes(standard)) throw new CliInputError(`--standard: must be one of ${STANDARDS.join(', ')}, got "${values.standard}"`);
  const format = (values.format ?? 'json') as CheckFormat;
  if (!CHECK_FORMATS.includes(format)) throw new CliInputError(`--format: must be one of ${CHECK_FORMATS.join(', ')}, got "${values.format}"`);
  if (NEEDS_OUT.includes(format) && !values.out) throw new CliInputError(`--format ${format}: needs --out FILE`);
  const limit = values['time-limit'] === undefined ? 300 : Number(values['time-limit']);
  if (!Number.isFinite(limit) || limit <= 0 || limit > 86_400) throw new CliInputError(`--time-limit: must be a number of seconds above 0, got "${values['time-limit']}"`);
  return {
    model: positional[0],
    standard,
    forces: values.forces ?? null,
    grade: values.grade ?? DEFAULT_GRADE[standard],
    format,
    out: values.out ?? null,
    timeLimitSeconds: limit,
    all,
  };
}
