import { verdictStyles } from './palette';

interface PlottedUnknown {
  x: number;
  y: number;
  sampleId: string;
  verdict: string | null;
  group: string | null;
}

/**
 * The unknowns of any two-axis plot by verdict, as open markers: an assigned unknown in its group's colour
 * and shape, ambiguous and unassigned ones in their verdict's style. Unknowns without a verdict are left to
 * the caller.
 */
export function unknownTraces<U extends PlottedUnknown, T extends object>(
  unknowns: U[],
  groups: string[],
  styleOf: (group: string) => { colour: string; symbol: string },
  markers: (name: string, points: U[]) => T,
) {
  const assigned = groups
    .map((group) => ({ group, points: unknowns.filter((u) => u.verdict === 'assigned' && u.group === group) }))
    .filter(({ points }) => points.length > 0)
    .map(({ group, points }) => ({
      ...markers(`Unknown, assigned to ${group}`, points),
      marker: {
        color: styleOf(group).colour,
        symbol: `${styleOf(group).symbol}${verdictStyles.assigned.symbolSuffix}`,
        size: 11,
        line: { width: 2 },
      },
    }));
  const others = (['ambiguous', 'unassigned'] as const)
    .map((verdict) => ({ verdict, points: unknowns.filter((u) => u.verdict === verdict) }))
    .filter(({ points }) => points.length > 0)
    .map(({ verdict, points }) => ({
      ...markers(`Unknown, ${verdictStyles[verdict].label.toLowerCase()}`, points),
      marker: {
        color: verdictStyles[verdict].colour,
        symbol: verdictStyles[verdict].symbol,
        size: 11,
        line: { width: 2 },
      },
    }));
  return [...assigned, ...others];
}
