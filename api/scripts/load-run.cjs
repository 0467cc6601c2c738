'use strict';
/**
 * One run for the load script: synthetic reference groups and unknowns (an invented scenario, three clay
 * sources on three elements in ppm), posted to the runs route and followed until it ends.
 */

const SOURCES = [
  { name: 'north-pit', mean: [120, 45, 3.2], sd: [8, 4, 0.3] },
  { name: 'river-terrace', mean: [95, 60, 2.1], sd: [7, 5, 0.25] },
  { name: 'upland', mean: [140, 30, 4.0], sd: [9, 3, 0.35] },
];

/** mulberry32, so that every load run posts the same numbers for the same seed. */
function random(seed) {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  // Box–Muller: two uniforms to one standard normal.
  return () => Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next());
}

function samples(count, seed, prefix, withGroups) {
  const normal = random(seed);
  return Array.from({ length: count }, (_, i) => {
    const source = SOURCES[i % SOURCES.length];
    return {
      sampleId: `${prefix}-${String(i + 1).padStart(6, '0')}`,
      ...(withGroups ? { group: source.name } : {}),
      values: source.mean.map((mean, j) => mean + source.sd[j] * normal()),
    };
  });
}

/**
 * Posts a classify run and polls it until it ends; answers { id, status }, with status "unfinished" when
 * `keepGoing` turns false first (the load phase is over).
 */
async function stackRun(send, base, session, lab, unknowns, seed, keepGoing = () => true) {
  const body = {
    kind: 'classify',
    parameters: {
      elements: ['Zr', 'Rb', 'Hf'],
      transform: 'ln',
      belowDetection: 'dl-half',
      covariance: 'classic',
      probability: 'hotelling',
      alpha: 0.05,
    },
    reference: samples(60, 11, 'ref', true),
    unknowns: samples(unknowns, 1000 + seed, 'unk', false),
  };
  const created = await send(base, session, 'POST', `${lab}/runs`, body);
  if (created.status !== 201) return { id: null, status: `refused ${created.status}` };
  const id = created.body.id;
  for (;;) {
    const res = await send(base, session, 'GET', `${lab}/runs/${id}`);
    const status = res.body?.status;
    if (status === 'succeeded' || status === 'failed' || status === 'cancelled') return { id, status };
    if (!keepGoing()) return { id, status: 'unfinished' };
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

module.exports = { stackRun };
