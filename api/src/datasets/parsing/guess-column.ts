import type { ColumnMapping, MeasurementUnit } from '@provenote/shared';

// Every element symbol, so "Zr_ppm" is recognised and "Site" is not taken for an element.
const ELEMENTS = new Set(
  (
    'H He Li Be B C N O F Ne Na Mg Al Si P S Cl Ar K Ca Sc Ti V Cr Mn Fe Co Ni Cu Zn Ga Ge As Se Br Kr Rb Sr Y Zr ' +
    'Nb Mo Tc Ru Rh Pd Ag Cd In Sn Sb Te I Xe Cs Ba La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu Hf Ta W Re Os ' +
    'Ir Pt Au Hg Tl Pb Bi Po At Rn Fr Ra Ac Th Pa U Np Pu'
  ).split(' '),
);

const SAMPLE_ID =
  /^(sample|samples|sample[\s._-]*(id|no\.?|name|number|code)|id|lab[\s._-]*(id|no\.?|number)|specimen|anid|name)$/i;
const GROUP = /^(group|groups|source|class|reference[\s._-]*group|ref[\s._-]*group|origin|provenance)$/i;
const OXIDE = /^([A-Z][a-z]?)(\d*)O(\d*)(?:T|tot|\(t\)|\(tot\)|\*)?$/;

/** Unit spellings seen in lab files, mapped to the units Provenote knows. "%" alone is decided by the name. */
export function normaliseUnit(text: string): MeasurementUnit | '%' | null {
  const unit = text.trim().toLowerCase().replace(/\s+/g, '').replace(/μ/g, 'µ');
  if (unit === 'ppm') return 'ppm';
  if (unit === 'ppb' || unit === 'ng/g') return 'ppb';
  if (unit === 'mg/kg') return 'mg/kg';
  if (unit === 'µg/g' || unit === 'ug/g') return 'µg/g';
  if (/^(wt\.?%|%|wt\.?pct|weight%|mass%|m%)$/.test(unit)) return '%';
  return null;
}

/** Splits "SiO2 (wt%)", "La [ppb]", "Zr_ppm", "Rb ppm" into a name and a unit text. */
function splitHeader(header: string): { name: string; unitText: string | null } {
  const bracketed = /^(.*?)\s*[([]\s*([^)\]]+)\s*[)\]]\s*$/.exec(header);
  if (bracketed) return { name: bracketed[1].trim(), unitText: bracketed[2] };
  const suffixed = /^(.*?)[\s_-]+([^\s_-]+)$/.exec(header);
  if (suffixed && normaliseUnit(suffixed[2]) !== null) return { name: suffixed[1].trim(), unitText: suffixed[2] };
  return { name: header.trim(), unitText: null };
}

function oxideOf(name: string): { element: string; formula: string } | null {
  const match = OXIDE.exec(name);
  if (!match || !ELEMENTS.has(match[1])) return null;
  return { element: match[1], formula: `${match[1]}${match[2]}O${match[3]}` };
}

/**
 * A first guess at one column's role and unit, from its header and the units row under it if the file has
 * one. The person confirms or corrects every guess before anything is stored.
 */
export function guessColumn(index: number, header: string, unitsCell: string | null): ColumnMapping {
  const base = { index, header, element: null, unit: null, oxide: null };
  const trimmed = header.trim();
  if (SAMPLE_ID.test(trimmed)) return { ...base, role: 'sample_id' };
  if (GROUP.test(trimmed)) return { ...base, role: 'group' };
  const { name, unitText } = splitHeader(trimmed);
  const unit = normaliseUnit(unitsCell ?? unitText ?? '');
  const oxide = oxideOf(name);
  if (oxide && (unit === null || unit === '%')) {
    return { ...base, role: 'measurement', element: oxide.element, unit: 'wt% oxide', oxide: oxide.formula };
  }
  if (ELEMENTS.has(name)) {
    const elementUnit: MeasurementUnit = unit === '%' ? 'wt% element' : (unit ?? 'ppm');
    return { ...base, role: 'measurement', element: name, unit: elementUnit };
  }
  return { ...base, role: 'attribute' };
}

/**
 * Guesses for every column. When no header names the sample id, the first column is taken for it; a second
 * column for an element already measured is kept as a note, for the person to choose between them.
 */
export function guessColumns(headers: string[], unitsRow: string[] | null): ColumnMapping[] {
  const columns = headers.map((header, i) => guessColumn(i, header, unitsRow?.[i] ?? null));
  const sampleIds = columns.filter((column) => column.role === 'sample_id');
  if (sampleIds.length === 0 && columns.length > 0 && columns[0].role !== 'measurement') columns[0].role = 'sample_id';
  sampleIds.slice(1).forEach((column) => (column.role = 'attribute'));
  columns
    .filter((column) => column.role === 'group')
    .slice(1)
    .forEach((column) => (column.role = 'attribute'));
  const measured = new Set<string>();
  for (const column of columns) {
    if (column.role !== 'measurement' || column.element === null) continue;
    if (measured.has(column.element))
      Object.assign(column, { role: 'attribute', element: null, unit: null, oxide: null });
    else measured.add(column.element);
  }
  return columns;
}
