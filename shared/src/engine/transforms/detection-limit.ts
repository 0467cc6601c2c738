import { InvalidInputError } from '../errors/engine-errors';

/**
 * A measured value, or a value reported below a detection limit ("<DL"). A zero counts as below the
 * column's detection limit when one is given for that column.
 */
export type Measurement = number | { readonly belowDetectionLimit: number };

export type ReplacementMethod = 'dl-half' | 'dl-sqrt2' | 'multiplicative';

export interface ReplacementOptions {
  readonly method: ReplacementMethod;
  /** Per-column detection limits that apply to zeros; null where a zero is a real value. */
  readonly columnDetectionLimits?: readonly (number | null)[];
  /** Multiplicative replacement: the replacement δ as a fraction of the detection limit (usual 0.65). */
  readonly deltaFraction?: number;
  /** Multiplicative replacement: the closure constant κ of a row (1, 100 for wt %, 1e6 for ppm). */
  readonly closure?: number;
}

export interface ReplacedData {
  readonly values: number[][];
  /** true where the value was imputed, not measured: kept beside the data so a reader sees both. */
  readonly imputed: boolean[][];
}

function detectionLimitOf(
  cell: Measurement,
  column: number,
  limits: readonly (number | null)[] | undefined,
): number | null {
  if (typeof cell !== 'number') return cell.belowDetectionLimit;
  if (cell === 0) return limits?.[column] ?? null;
  return null;
}

/**
 * Replaces values below the detection limit (and zeros with a known limit).
 * - 'dl-half', 'dl-sqrt2': simple substitution by DL/2 or DL/√2 (Hornung & Reed 1990, Applied
 *   Occupational and Environmental Hygiene 5:46).
 * - 'multiplicative': rⱼ = δⱼ where xⱼ is below DL, otherwise (1 − Σδₖ/κ)·xⱼ (Martín-Fernández,
 *   Barceló-Vidal & Pawlowsky-Glahn 2003, Mathematical Geology 35:253). It keeps the ratios among the
 *   measured parts unchanged, so log-ratio analyses of those parts are not disturbed.
 */
export function replaceBelowDetectionLimit(
  rows: readonly (readonly Measurement[])[],
  options: ReplacementOptions,
): ReplacedData {
  const deltaFraction = options.deltaFraction ?? 0.65;
  const closure = options.closure ?? 1;
  if (!(deltaFraction > 0 && deltaFraction < 1)) {
    throw new InvalidInputError(`deltaFraction must lie in (0, 1), got ${deltaFraction}`);
  }
  if (!(closure > 0) || !Number.isFinite(closure))
    throw new InvalidInputError(`closure must be positive, got ${closure}`);
  const values: number[][] = [];
  const imputed: boolean[][] = [];
  rows.forEach((row, i) => {
    const limits = row.map((cell, j) => detectionLimitOf(cell, j, options.columnDetectionLimits));
    limits.forEach((limit, j) => {
      if (limit !== null && !(limit > 0 && Number.isFinite(limit))) {
        throw new InvalidInputError(`row ${i + 1}, column ${j + 1}: detection limit must be positive, got ${limit}`);
      }
    });
    imputed.push(limits.map((limit) => limit !== null));
    if (options.method === 'multiplicative') {
      const deltaTotal = limits.reduce<number>((sum, limit) => sum + (limit === null ? 0 : deltaFraction * limit), 0);
      const shrink = 1 - deltaTotal / closure;
      if (!(shrink > 0)) {
        throw new InvalidInputError(
          `row ${i + 1}: the replaced values add up to the closure constant ${closure} or more`,
        );
      }
      values.push(
        row.map((cell, j) => (limits[j] === null ? (cell as number) * shrink : deltaFraction * (limits[j] as number))),
      );
    } else {
      const divisor = options.method === 'dl-half' ? 2 : Math.SQRT2;
      values.push(row.map((cell, j) => (limits[j] === null ? (cell as number) : (limits[j] as number) / divisor)));
    }
  });
  return { values, imputed };
}
