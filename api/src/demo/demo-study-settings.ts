import type { CreateStudy, DatasetKind, StepParameters } from '@provenote/shared';

/** The two files of the synthetic Lake Tarn scenario (samples/README.md), as the demo analyst imports them. */
export const DEMO_FILES: Record<DatasetKind, { filename: string; name: string }> = {
  reference: { filename: 'reference-soils.csv', name: 'Lake Tarn catchment soils (synthetic)' },
  unknowns: { filename: 'reservoir-core.csv', name: 'Core TR-2 slices (synthetic)' },
};

export const REVIEWED_STUDY: CreateStudy = {
  name: 'Core TR-2 sources (synthetic demo)',
  description:
    'Which source area of the Lake Tarn catchment did each slice of Core TR-2 come from? Synthetic data. ' +
    'Five source areas, nine elements in natural logs; one slice overridden by the analyst after review.',
};

export const FRESH_STUDY: CreateStudy = {
  name: 'Core TR-2, your own try (synthetic demo)',
  description:
    'The same data with only the Data card filled: choose elements and a transform, pick the groups, run the ' +
    'group check and the assignment yourself.',
};

/**
 * Nine elements, natural logs: Limestone karst has only 16 members, too few for all 24 elements, and these
 * nine separate the five sources (samples/README.md, "What a quick check outside the product gave").
 */
export const DEMO_PREPARE: StepParameters['prepare'] = {
  elements: ['Ti', 'Fe', 'K', 'Ca', 'Rb', 'Sr', 'Zr', 'Th', 'Cr'],
  transform: 'ln',
  alrDenominator: null,
  belowDetection: 'dl-half',
  covariance: 'classic',
  seed: 20250917,
};

export const DEMO_ASSIGN: StepParameters['assign'] = { probability: 'hotelling', alpha: 0.05 };

/** Slices TR2-021 to TR2-050: the 40–100 cm interval, where schist-derived silt dominates the core. */
export const SCHIST_INTERVAL = { first: 'TR2-021', last: 'TR2-050' };

export const DEMO_OVERRIDE_REASON =
  'Ambiguous between Schist valley and Glacial till on these elements. The slice lies in the 40–100 cm ' +
  'interval of the core log, where schist-derived silt dominates, so it is assigned to Schist valley.';
