import { classifyInBlocks, type PackedGroups } from '@provenote/shared';

export interface BlockSummary {
  /** Pairs with p_chi2 ≥ 0.05 and with p_hotelling ≥ 0.05: a checksum that uses every output. */
  readonly typicalChi2: number;
  readonly typicalHotelling: number;
  readonly sumD2: number;
}

/** Classifies rows [rowStart, rowEnd) in blocks and folds the outputs into a checksum. */
export function classifyAndSummarise(
  groups: PackedGroups,
  data: Float64Array,
  rowStart: number,
  rowEnd: number,
): BlockSummary {
  let typicalChi2 = 0;
  let typicalHotelling = 0;
  let sumD2 = 0;
  const g = groups.names.length;
  classifyInBlocks(
    groups,
    data,
    (_, rows, out) => {
      for (let e = 0; e < rows * g; e++) {
        sumD2 += out.d2[e];
        if (out.pChi2[e] >= 0.05) typicalChi2++;
        if (out.pHotelling[e] >= 0.05) typicalHotelling++;
      }
    },
    4096,
    rowStart,
    rowEnd,
  );
  return { typicalChi2, typicalHotelling, sumD2 };
}

export function addSummaries(parts: readonly BlockSummary[]): BlockSummary {
  return parts.reduce(
    (a, b) => ({
      typicalChi2: a.typicalChi2 + b.typicalChi2,
      typicalHotelling: a.typicalHotelling + b.typicalHotelling,
      sumD2: a.sumD2 + b.sumD2,
    }),
    { typicalChi2: 0, typicalHotelling: 0, sumD2: 0 },
  );
}
