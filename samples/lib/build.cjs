'use strict';
/** Builds the whole scenario from one seed: reference groups, core TR-2, its truth table, as file texts. */
const { mulberry32 } = require('./random.cjs');
const { makeSampler, mix } = require('./draw.cjs');
const { standardCsv, europeanCsv, formatNumber } = require('./format.cjs');
const { COLUMNS, SOURCES, CORE } = require('./scenario.cjs');

const TEPHRA = SOURCES.findIndex((source) => source.size === null);
/** Only trace elements are ever "n.d." in the files: a major-element run is all or nothing. */
const TRACE_COLUMNS = COLUMNS.map((column, j) => (column.unit === 'ppm' ? j : -1)).filter((j) => j >= 0);

/** Separate streams keep the reference groups unchanged when only the core's design is edited. */
const REFERENCE_STREAM = 0x5eed0001;
const CORE_STREAM = 0x5eed0002;

function buildReferences(random, samplers) {
  const rows = [];
  SOURCES.forEach((source, s) => {
    if (source.size === null) return;
    for (let i = 1; i <= source.size; i += 1) {
      rows.push({
        id: `LT-${source.code}-${String(i).padStart(2, '0')}`,
        group: source.name,
        values: samplers[s](random),
      });
    }
  });
  markOneNotDetermined(random, rows);
  return rows;
}

function markOneNotDetermined(random, rows) {
  rows[random.int(rows.length)].notDetermined = TRACE_COLUMNS[random.int(TRACE_COLUMNS.length)];
}

/** Another source with the segment's weights, never `exclude` nor the tephra. */
function otherSource(random, weights, exclude) {
  return random.weighted(weights.map((w, s) => (s === exclude || s === TEPHRA ? 0 : w)));
}

/** Slice indices that become two-source mixtures: a partial Fisher–Yates draw outside the tephra layer. */
function pickMixtureSlices(random, slices) {
  const candidates = slices.filter((slice) => !slice.segment.tephraLayer).map((slice) => slice.index);
  for (let i = 0; i < CORE.mixtureCount; i += 1) {
    const j = i + random.int(candidates.length - i);
    [candidates[i], candidates[j]] = [candidates[j], candidates[i]];
  }
  return new Set(candidates.slice(0, CORE.mixtureCount));
}

function coreSlices() {
  const slices = [];
  for (const segment of CORE.segments) {
    for (let k = 0; k < segment.slices; k += 1) slices.push({ index: slices.length, segment });
  }
  return slices;
}

/** The parts of one slice, largest share first, and what kind of origin the truth table records. */
function sliceRecipe(random, slice, isMixture) {
  const weights = slice.segment.weights;
  if (slice.segment.tephraLayer) {
    const share = random.uniform(...CORE.tephraShare);
    return { origin: 'unmapped', parts: [part(TEPHRA, share), part(otherSource(random, weights, TEPHRA), 1 - share)] };
  }
  const main = random.weighted(weights);
  const second = otherSource(random, weights, main);
  if (isMixture) {
    const share = random.uniform(...CORE.mixtureShare);
    const parts = [part(main, share), part(second, 1 - share)].sort((a, b) => b.share - a.share);
    return { origin: 'mixture', parts };
  }
  const admixture = random.uniform(0, CORE.maxAdmixture);
  return { origin: 'single', parts: [part(main, 1 - admixture), part(second, admixture)] };
}

function part(source, share) {
  return { source, share };
}

function buildCore(random, samplers) {
  const slices = coreSlices();
  const mixtures = pickMixtureSlices(random, slices);
  const rows = slices.map((slice) => {
    const recipe = sliceRecipe(random, slice, mixtures.has(slice.index));
    const values = mix(recipe.parts.map((p) => ({ share: p.share, values: samplers[p.source](random) })));
    const depthCm = (slice.index + 0.5) * CORE.sliceThicknessCm;
    return { id: `${CORE.id}-${String(slice.index + 1).padStart(3, '0')}`, depthCm, values, ...recipe };
  });
  markOneNotDetermined(random, rows);
  return rows;
}

function truthCsv(rows) {
  const header = 'sample_id,depth_cm,origin,main_source,main_share,second_source,second_share';
  const lines = rows.map((row) => {
    const [main, second] = row.parts;
    const share = (p) => formatNumber(p.share, 3, '.');
    return [
      row.id,
      row.depthCm,
      row.origin,
      SOURCES[main.source].name,
      share(main),
      SOURCES[second.source].name,
      share(second),
    ].join(',');
  });
  return [header, ...lines].join('\n') + '\n';
}

const idField = { header: 'sample_id', euHeader: 'Sample', euUnit: '', cell: (row) => row.id };
const groupField = { header: 'group', cell: (row) => row.group };
const depthField = {
  header: 'depth_cm',
  euHeader: 'Depth',
  euUnit: 'cm',
  cell: (row, decimalSeparator) => formatNumber(row.depthCm, 0, decimalSeparator),
};

function buildScenario(seed) {
  if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff)
    throw new Error(`seed must be a 32-bit unsigned integer, got ${seed}`);
  const samplers = SOURCES.map((source, s) => makeSampler(s, source.factorStrength));
  const references = buildReferences(mulberry32((seed ^ REFERENCE_STREAM) >>> 0), samplers);
  const core = buildCore(mulberry32((seed ^ CORE_STREAM) >>> 0), samplers);
  return {
    references,
    core,
    files: {
      'reference-soils.csv': standardCsv([idField, groupField], references),
      'reservoir-core.csv': standardCsv([idField, depthField], core),
      'reservoir-core-eu.csv': europeanCsv([idField, depthField], core),
      'truth.csv': truthCsv(core),
    },
  };
}

module.exports = { buildScenario };
