import type { ProbabilityMap } from '@provenote/shared/schemas';

export type ProbabilityBasis = 'chi2' | 'hotelling';

/** Beyond this many rows the sample ids cannot be read beside the map; hover still names each one. */
const LABELLED_ROWS = 60;

/**
 * The probability heat map of a run: a row per unknown (or per drawn unknown of a thinned run), a column
 * per group. Values are the run's own probabilities, shown as they are (nothing is computed here); the
 * hover text lists the sample's probability for every group, not only the cell's.
 */
export function heatmapTrace(map: ProbabilityMap, basis: ProbabilityBasis) {
  const z = map.rows.map((row) => (basis === 'chi2' ? row.pChi2 : row.pHotelling));
  const summaries = z.map((ps) => map.groups.map((g, j) => `${g}: ${ps[j].toFixed(4)}`).join('<br>'));
  return {
    type: 'heatmap' as const,
    x: map.groups,
    y: map.rows.map((row) => row.sampleId),
    z,
    customdata: summaries.map((summary) => map.groups.map(() => summary)),
    zmin: 0,
    zmax: 1,
    colorscale: 'Cividis',
    colorbar: { title: { text: basis === 'chi2' ? 'p (χ²)' : 'p (Hotelling)' } },
    hovertemplate: 'Sample %{y}<br>%{customdata}<extra></extra>',
  };
}

export function heatmapLayout(map: ProbabilityMap) {
  return {
    yaxis: {
      autorange: 'reversed',
      type: 'category',
      title: { text: 'Unknowns, by best group' },
      showticklabels: map.rows.length <= LABELLED_ROWS,
    },
    xaxis: { title: { text: 'Group' } },
  };
}

/** Tall enough to tell rows apart, never taller than a laptop screen. */
export const heatmapHeight = (map: ProbabilityMap) => Math.min(640, Math.max(320, 16 * map.rows.length + 120));
