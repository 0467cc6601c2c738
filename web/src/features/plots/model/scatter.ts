import type { Scatter } from '@provenote/shared/schemas';
import { groupStyle } from './palette';
import { unknownTraces } from './unknown-traces';

const hover = (x: string, y: string, unit: string) =>
  `Sample %{customdata}<br>${x} %{x}${unit}<br>${y} %{y}${unit}<extra>%{fullData.name}</extra>`;

/**
 * Plotly traces for two coordinates (in ppm when `inPpm`, else as the transform names them): one trace per reference group (its colour and shape, filled),
 * then the unknowns by verdict as open markers — an assigned unknown in its group's colour and shape.
 * Values are drawn as stored; nothing is computed here.
 */
export function scatterTraces(data: Scatter, groupOrder: string[], inPpm = true) {
  const groups = [...new Set([...groupOrder, ...data.reference.map((p) => p.group)])];
  const styleOf = (group: string) => groupStyle(groups.indexOf(group));
  const base = (name: string, points: { x: number; y: number; sampleId: string }[]) => ({
    type: 'scatter' as const,
    mode: 'markers' as const,
    name,
    x: points.map((p) => p.x),
    y: points.map((p) => p.y),
    customdata: points.map((p) => p.sampleId),
    hovertemplate: hover(data.x, data.y, inPpm ? ' ppm' : ''),
  });
  const reference = groups
    .map((group) => ({ group, points: data.reference.filter((p) => p.group === group) }))
    .filter(({ points }) => points.length > 0)
    .map(({ group, points }) => ({
      ...base(group, points),
      marker: { color: styleOf(group).colour, symbol: styleOf(group).symbol, size: 8, opacity: 0.75 },
    }));
  const unknowns = unknownTraces(data.unknowns, groups, styleOf, base);
  const pending = data.unknowns.filter((u) => u.verdict === null);
  const notAssigned =
    pending.length > 0
      ? [
          {
            ...base('Unknown, not assigned yet', pending),
            marker: { color: '#777777', symbol: 'circle-open', size: 9 },
          },
        ]
      : [];
  return [...reference, ...unknowns, ...notAssigned];
}
