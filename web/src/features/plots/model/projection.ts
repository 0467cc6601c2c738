import type { Projection } from '@provenote/shared/schemas';
import { groupStyle } from './palette';
import { unknownTraces } from './unknown-traces';

/** "PC1 (72.4 %)": the axis and the share of the variance (or of the between-group trace) it carries. */
export const axisTitle = (axis: Projection['axes'][number]) => `${axis.label} (${(axis.share * 100).toFixed(1)} %)`;

/**
 * Plotly traces of a stored projection: each group's reference samples in its colour and shape with its
 * ellipse outline in the same colour, then the unknowns by verdict as open markers. Scores and outlines
 * are drawn as the API sent them; nothing is computed here.
 */
export function projectionTraces(data: Projection, groupOrder: string[]) {
  const groups = [...new Set([...groupOrder, ...data.groups.map((g) => g.name)])];
  const styleOf = (group: string) => groupStyle(groups.indexOf(group));
  const [a, b] = data.axes.map((axis) => axis.label);
  const markers = (name: string, points: { x: number; y: number; sampleId: string }[]) => ({
    type: 'scatter' as const,
    mode: 'markers' as const,
    name,
    x: points.map((p) => p.x),
    y: points.map((p) => p.y),
    customdata: points.map((p) => p.sampleId),
    hovertemplate: `Sample %{customdata}<br>${a} %{x:.3f}<br>${b} %{y:.3f}<extra>%{fullData.name}</extra>`,
  });
  const perGroup = data.groups.flatMap((group) => {
    const style = styleOf(group.name);
    const points = data.reference.filter((p) => p.group === group.name);
    const outline = group.ellipse
      ? [
          {
            type: 'scatter' as const,
            mode: 'lines' as const,
            name: `${group.name}, ${Math.round(data.level * 100)} % ellipse`,
            x: group.ellipse.x,
            y: group.ellipse.y,
            line: { color: style.colour, width: 1.5 },
            hoverinfo: 'skip' as const,
          },
        ]
      : [];
    return [
      { ...markers(group.name, points), marker: { color: style.colour, symbol: style.symbol, size: 8, opacity: 0.75 } },
      ...outline,
    ];
  });
  const unknowns = unknownTraces(data.unknowns, groups, styleOf, markers);
  return [...perGroup, ...unknowns];
}
