import {
  DEFAULT_MCD_SEED,
  TRANSFORM_NAMES,
  type CovarianceMethod,
  type ProbabilityBasis,
  type ReplacementMethod,
  type TransformName,
} from '@provenote/shared';
import { UsageError } from './cli-errors';

export interface DataOptions {
  readonly reference: string;
  readonly out: string;
  readonly idColumn: string;
  readonly groupColumn: string;
  /** null: every numeric column except the id and group columns. */
  readonly elements: string[] | null;
  readonly transform: TransformName;
  readonly alrDenominator: string | null;
  readonly covariance: CovarianceMethod;
  readonly probability: ProbabilityBasis;
  readonly alpha: number;
  readonly seed: number;
  /** How values reported as "<DL" are replaced. */
  readonly belowLimit: ReplacementMethod;
  /** Closure constant of a row for multiplicative replacement (1e6 for ppm). */
  readonly closure: number;
}

export interface ClassifyOptions extends DataOptions {
  readonly unknowns: string;
}

export type ParsedCommand =
  { command: 'classify'; options: ClassifyOptions } | { command: 'check'; options: DataOptions } | { command: 'help' };

export const USAGE = `Usage:
  provenote classify --reference REF.csv --unknowns UNK.csv --out DIR [options]
  provenote check --reference REF.csv --out DIR [options]
  provenote verify BUNDLE.zip

Options:
  --id-column NAME          sample id column (default sample_id)
  --group-column NAME       reference group column (default group)
  --elements A,B,...        variables to use (default: every numeric column but the two above)
  --transform T             none | log10 | ln | alr | clr | ilr (default none)
  --alr-denominator EL      denominator part for alr (default: the last element)
  --covariance C            classic | mcd (default classic)
  --probability P           chi2 | hotelling: the basis of the verdicts (default chi2)
  --alpha A                 level of the verdicts, 0 < A < 1 (default 0.05)
  --seed N                  seed of the MCD random subsets (default ${DEFAULT_MCD_SEED})
  --below-limit M           replacement of "<DL" cells: dl-half | dl-sqrt2 | multiplicative (default dl-half)
  --closure K               row total for multiplicative replacement (default 1000000, ppm)

Output of classify: distances.csv (D², p_chi2, p_hotelling per sample and group), assignments.csv (verdicts),
posteriors.csv (quadratic-rule posteriors with equal priors, a second view only) and run.json.
Output of check: members.csv (leave-one-out) and separation.csv (pairwise Hotelling's T²).`;

const VALUE_OPTIONS = [
  'reference',
  'unknowns',
  'out',
  'id-column',
  'group-column',
  'elements',
  'transform',
  'alr-denominator',
  'covariance',
  'probability',
  'alpha',
  'seed',
  'below-limit',
  'closure',
] as const;
type OptionName = (typeof VALUE_OPTIONS)[number];

function choice<T extends string>(name: string, value: string | undefined, allowed: readonly T[], fallback: T): T {
  if (value === undefined) return fallback;
  if (!(allowed as readonly string[]).includes(value))
    throw new UsageError(`--${name} must be one of ${allowed.join(', ')}; got "${value}"`);
  return value as T;
}

function numberOption(
  name: string,
  value: string | undefined,
  fallback: number,
  valid: (x: number) => boolean,
  rule: string,
): number {
  if (value === undefined) return fallback;
  const parsed = Number(value);
  if (value.trim() === '' || !valid(parsed)) throw new UsageError(`--${name} must be ${rule}; got "${value}"`);
  return parsed;
}

/** Parses `classify …` or `check …` (argv without the node and script paths). */
export function parseArguments(argv: readonly string[]): ParsedCommand {
  const [command, ...rest] = argv;
  if (command === undefined || command === 'help' || command === '--help' || command === '-h')
    return { command: 'help' };
  if (command !== 'classify' && command !== 'check')
    throw new UsageError(`unknown command "${command}"; use classify or check`);
  const values: Partial<Record<OptionName, string>> = {};
  for (let i = 0; i < rest.length; i++) {
    const token = rest[i];
    const [flag, inline] =
      token.startsWith('--') && token.includes('=')
        ? [token.slice(0, token.indexOf('=')), token.slice(token.indexOf('=') + 1)]
        : [token, undefined];
    const name = flag.replace(/^--/, '') as OptionName;
    if (!flag.startsWith('--') || !VALUE_OPTIONS.includes(name)) throw new UsageError(`unknown option "${token}"`);
    const value = inline ?? rest[++i];
    if (value === undefined) throw new UsageError(`option --${name} needs a value`);
    values[name] = value;
  }
  const required = (name: OptionName): string => {
    const value = values[name];
    if (value === undefined || value === '') throw new UsageError(`option --${name} is required for ${command}`);
    return value;
  };
  const data: DataOptions = {
    reference: required('reference'),
    out: required('out'),
    idColumn: values['id-column'] ?? 'sample_id',
    groupColumn: values['group-column'] ?? 'group',
    elements:
      values.elements === undefined
        ? null
        : values.elements
            .split(',')
            .map((e) => e.trim())
            .filter((e) => e !== ''),
    transform: choice('transform', values.transform, TRANSFORM_NAMES, 'none'),
    alrDenominator: values['alr-denominator'] ?? null,
    covariance: choice<CovarianceMethod>('covariance', values.covariance, ['classic', 'mcd'], 'classic'),
    probability: choice<ProbabilityBasis>('probability', values.probability, ['chi2', 'hotelling'], 'chi2'),
    alpha: numberOption('alpha', values.alpha, 0.05, (x) => x > 0 && x < 1, 'a number strictly between 0 and 1'),
    seed: numberOption(
      'seed',
      values.seed,
      DEFAULT_MCD_SEED,
      (x) => Number.isInteger(x) && x >= 0 && x < 2 ** 32,
      'an integer from 0 to 4294967295',
    ),
    belowLimit: choice<ReplacementMethod>(
      'below-limit',
      values['below-limit'],
      ['dl-half', 'dl-sqrt2', 'multiplicative'],
      'dl-half',
    ),
    closure: numberOption('closure', values.closure, 1e6, (x) => x > 0 && Number.isFinite(x), 'a positive number'),
  };
  if (data.elements !== null && data.elements.length === 0) throw new UsageError('--elements lists no element');
  if (data.alrDenominator !== null && data.transform !== 'alr')
    throw new UsageError('--alr-denominator applies only with --transform alr');
  if (command === 'check') {
    if (values.unknowns !== undefined) throw new UsageError('check takes no --unknowns');
    return { command, options: data };
  }
  return { command, options: { ...data, unknowns: required('unknowns') } };
}
