import type { AssignmentsPage } from '@provenote/shared/schemas';

export type ProbabilityBasis = 'chi2' | 'hotelling';

/**
 * The probability heat map of one results page: a row per unknown, a column per group. Values are the
 * run's own probabilities, shown as they are (nothing is computed here).
 */
export function heatmapTrace(page: AssignmentsPage, basis: ProbabilityBasis) {
  const groups = page.groups.map((g) => g.name);
  const samples = page.rows.map((row) => row.sampleId);
  const z = page.rows.map((row) => (basis === 'chi2' ? row.pChi2 : row.pHotelling));
  return {
    type: 'heatmap' as const,
    x: groups,
    y: samples,
    z,
    zmin: 0,
    zmax: 1,
    colorscale: 'Cividis',
    colorbar: { title: { text: basis === 'chi2' ? 'p (χ²)' : 'p (Hotelling)' } },
    hovertemplate: 'Sample %{y}<br>Group %{x}<br>p = %{z:.4f}<extra></extra>',
  };
}
