/**
 * Provenote's group styles: every group gets a colour and a marker shape, so groups stay apart in grey
 * print and for readers with a colour-vision deficiency. The colours are spaced in hue and lightness to
 * stay distinct under protanopia, deuteranopia and tritanopia; the shapes differ in outline, so a shape
 * alone identifies a group.
 */
export const groupColours = [
  '#1f5fa8', // deep blue
  '#d9822b', // amber
  '#2a9d77', // sea green
  '#c2417a', // raspberry
  '#7a5cc4', // violet
  '#8c6d1f', // ochre brown
  '#3fa7d6', // sky
  '#555555', // graphite
] as const;

export const groupSymbols = [
  'circle',
  'square',
  'diamond',
  'triangle-up',
  'pentagon',
  'hexagon',
  'triangle-down',
  'star',
] as const;

export interface GroupStyle {
  colour: string;
  symbol: string;
}

/**
 * The style of the i-th group. Past eight groups the shapes shift by one against the colours, so the
 * first 64 groups all get a different pair.
 */
export function groupStyle(index: number): GroupStyle {
  if (!Number.isInteger(index) || index < 0) throw new Error(`a group index is a whole number from 0, not ${index}`);
  const n = groupColours.length;
  return { colour: groupColours[index % n], symbol: groupSymbols[(index + Math.floor(index / n)) % n] };
}

/** Unknowns drawn over the reference groups: open markers, so the reference points stay readable. */
export const verdictStyles = {
  assigned: { symbolSuffix: '-open', colour: null, label: 'Assigned' },
  ambiguous: { symbol: 'circle-open-dot', colour: '#222222', label: 'Ambiguous' },
  unassigned: { symbol: 'x-thin-open', colour: '#000000', label: 'Unassigned' },
} as const;
