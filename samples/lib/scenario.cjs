'use strict';
/**
 * The invented Lake Tarn scenario: five mapped source areas of a fictional upland catchment, one unmapped
 * source (a rhyolitic tephra fall), and the sediment sequence of reservoir core TR-2. Every number here is
 * made up to look like published ranges for such rocks and soils; nothing is taken from a real dataset.
 */

/** [column, unit, decimals written, detection limit or null]. Fe2O3 is total iron. LOI is not an element. */
const COLUMNS = [
  ['SiO2', 'wt%', 2, null],
  ['TiO2', 'wt%', 3, null],
  ['Al2O3', 'wt%', 2, null],
  ['Fe2O3', 'wt%', 2, null],
  ['MnO', 'wt%', 3, 0.005],
  ['MgO', 'wt%', 2, null],
  ['CaO', 'wt%', 2, null],
  ['Na2O', 'wt%', 2, null],
  ['K2O', 'wt%', 2, null],
  ['P2O5', 'wt%', 3, 0.005],
  ['LOI', 'wt%', 2, null],
  ['Rb', 'ppm', 1, 0.5],
  ['Sr', 'ppm', 0, 2],
  ['Ba', 'ppm', 0, 5],
  ['Zr', 'ppm', 0, 2],
  ['Nb', 'ppm', 1, 1],
  ['Y', 'ppm', 1, 0.5],
  ['Th', 'ppm', 2, 0.5],
  ['U', 'ppm', 2, 0.5],
  ['La', 'ppm', 1, 1],
  ['Ce', 'ppm', 1, 1],
  ['Cr', 'ppm', 0, 5],
  ['Ni', 'ppm', 0, 3],
  ['V', 'ppm', 0, 5],
  ['Pb', 'ppm', 1, 2],
].map(([name, unit, decimals, detectionLimit]) => ({ name, unit, decimals, detectionLimit }));

/** Oxides closed to 100 − LOI per sample, as a full major-element analysis adds up. */
const MAJOR_OXIDES = ['SiO2', 'TiO2', 'Al2O3', 'Fe2O3', 'MnO', 'MgO', 'CaO', 'Na2O', 'K2O', 'P2O5'];

/**
 * Log-scale factor loadings (mafic minerals, K-feldspar and mica, accessory minerals such as zircon and
 * monazite, carbonate and plagioclase, light rare earths). They give the usual geochemical associations:
 * Fe–Mg–Cr–Ni–V together and against SiO2, K–Rb–Ba, Ca–Sr, Zr–Y–Th–U, La–Ce.
 */
const LOADINGS = {
  SiO2: [-0.55, 0.1, 0, -0.35, 0],
  TiO2: [0.6, 0, 0.3, 0, 0],
  Al2O3: [0.1, 0.5, 0, 0, 0],
  Fe2O3: [0.8, 0, 0, 0, 0],
  MnO: [0.5, 0, 0, 0.2, 0],
  MgO: [0.8, 0, 0, 0.25, 0],
  CaO: [0.3, 0, 0, 0.75, 0],
  Na2O: [0, 0.2, 0, 0.4, 0],
  K2O: [-0.2, 0.85, 0, 0, 0],
  P2O5: [0.3, 0, 0.4, 0.2, 0],
  LOI: [0, 0, 0, 0.5, 0],
  Rb: [-0.2, 0.85, 0.1, 0, 0],
  Sr: [0.1, 0, 0, 0.75, 0],
  Ba: [0, 0.55, 0, 0.2, 0],
  Zr: [0, 0, 0.75, 0, 0],
  Nb: [0.2, 0, 0.55, 0, 0],
  Y: [0, 0, 0.6, 0, 0.4],
  Th: [0, 0.2, 0.5, 0, 0.5],
  U: [0, 0.1, 0.55, 0, 0.3],
  La: [0, 0, 0.4, 0, 0.8],
  Ce: [0, 0, 0.4, 0, 0.8],
  Cr: [0.8, 0, 0, 0, 0],
  Ni: [0.8, 0, 0, 0, 0],
  V: [0.75, 0, 0.1, 0, 0],
  Pb: [0, 0.4, 0, 0, 0],
};

/** Sources in the column order of MEANS and LOG_SDS. `size` is the reference group's n (null: unmapped). */
const SOURCES = [
  { code: 'GRA', name: 'Granite uplands', size: 42, factorStrength: [0.8, 1, 1, 0.5, 1] },
  { code: 'BAS', name: 'Basalt plateau', size: 34, factorStrength: [1, 0.6, 0.8, 0.7, 0.8] },
  { code: 'SCH', name: 'Schist valley', size: 48, factorStrength: [0.9, 1, 0.9, 0.5, 1] },
  { code: 'KAR', name: 'Limestone karst', size: 16, factorStrength: [0.7, 0.8, 0.8, 1, 0.8] },
  { code: 'TIL', name: 'Glacial till', size: 38, factorStrength: [1, 1, 1, 0.8, 1] },
  { code: 'TEP', name: 'Tephra (unmapped)', size: null, factorStrength: [0.5, 0.6, 0.8, 0.5, 0.8] },
];

/** Geometric means before closure (wt % or ppm). */
// prettier-ignore
const MEANS = {
  //      GRA    BAS    SCH    KAR    TIL    TEP
  SiO2:  [71.5,  48.8,  61.5,  24,    65.5,  72.5],
  TiO2:  [0.32,  2.1,   0.82,  0.36,  0.75,  0.2],
  Al2O3: [14.2,  14.6,  18.2,  7.2,   14.6,  12.8],
  Fe2O3: [2.3,   12.4,  6.9,   3.6,   5.2,   2],
  MnO:   [0.045, 0.18,  0.1,   0.08,  0.09,  0.065],
  MgO:   [0.55,  6.8,   2.4,   1.6,   2,     0.32],
  CaO:   [1.1,   9.8,   1.05,  30,    2.5,   1.45],
  Na2O:  [3.3,   2.7,   1.55,  0.3,   2.4,   5.3],
  K2O:   [4.6,   0.65,  3.5,   1.15,  2.8,   2.6],
  P2O5:  [0.13,  0.27,  0.15,  0.12,  0.14,  0.04],
  LOI:   [1.2,   1.6,   3,     26,    3.6,   3.8],
  Rb:    [215,   13,    150,   46,    100,   58],
  Sr:    [105,   330,   120,   460,   200,   95],
  Ba:    [560,   190,   610,   150,   520,   840],
  Zr:    [185,   145,   205,   72,    275,   540],
  Nb:    [15,    14,    16,    6.5,   14,    33],
  Y:     [34,    28,    30,    15,    28,    68],
  Th:    [22,    1.6,   14.5,  5.2,   11.5,  9.2],
  U:     [5.2,   0.72,  2.8,   2.3,   2.7,   3.1],
  La:    [41,    13,    42,    17,    34,    37],
  Ce:    [82,    29,    86,    31,    70,    77],
  Cr:    [9,     290,   108,   46,    78,    3],
  Ni:    [4.5,   135,   48,    26,    30,    2.2],
  V:     [22,    305,   138,   52,    98,    9],
  Pb:    [31,    3.6,   21,    19,    21,    15],
};

/** Standard deviations of the natural logarithms (log-normal spreads). */
// prettier-ignore
const LOG_SDS = {
  //      GRA    BAS    SCH    KAR    TIL    TEP
  SiO2:  [0.03,  0.025, 0.04,  0.2,   0.05,  0.02],
  TiO2:  [0.18,  0.12,  0.12,  0.22,  0.18,  0.12],
  Al2O3: [0.06,  0.05,  0.07,  0.22,  0.08,  0.04],
  Fe2O3: [0.2,   0.07,  0.12,  0.22,  0.2,   0.1],
  MnO:   [0.22,  0.1,   0.25,  0.3,   0.22,  0.15],
  MgO:   [0.25,  0.14,  0.15,  0.3,   0.25,  0.2],
  CaO:   [0.25,  0.1,   0.35,  0.25,  0.35,  0.12],
  Na2O:  [0.12,  0.1,   0.25,  0.3,   0.15,  0.06],
  K2O:   [0.08,  0.3,   0.12,  0.25,  0.15,  0.06],
  P2O5:  [0.2,   0.18,  0.2,   0.25,  0.2,   0.2],
  LOI:   [0.3,   0.35,  0.2,   0.12,  0.25,  0.2],
  Rb:    [0.15,  0.35,  0.15,  0.25,  0.22,  0.1],
  Sr:    [0.25,  0.18,  0.3,   0.25,  0.22,  0.12],
  Ba:    [0.2,   0.25,  0.15,  0.25,  0.18,  0.1],
  Zr:    [0.2,   0.15,  0.2,   0.25,  0.25,  0.1],
  Nb:    [0.18,  0.2,   0.12,  0.25,  0.18,  0.1],
  Y:     [0.2,   0.12,  0.15,  0.22,  0.18,  0.1],
  Th:    [0.22,  0.35,  0.15,  0.25,  0.22,  0.1],
  U:     [0.28,  0.35,  0.2,   0.25,  0.22,  0.12],
  La:    [0.22,  0.2,   0.15,  0.25,  0.2,   0.1],
  Ce:    [0.2,   0.18,  0.15,  0.25,  0.2,   0.1],
  Cr:    [0.4,   0.3,   0.18,  0.25,  0.3,   0.4],
  Ni:    [0.4,   0.28,  0.22,  0.28,  0.3,   0.4],
  V:     [0.3,   0.12,  0.15,  0.25,  0.25,  0.3],
  Pb:    [0.2,   0.35,  0.25,  0.3,   0.25,  0.15],
};

/**
 * Core TR-2: 120 slices of 2 cm, youngest at the top. Each depth range has its own mix of sources, as land
 * use and erosion changed in the catchment; source weights are in SOURCES order (the tephra is placed apart).
 */
const CORE = {
  id: 'TR2',
  sliceThicknessCm: 2,
  segments: [
    { slices: 20, weights: [0.45, 0, 0.35, 0, 0.2, 0] },
    { slices: 30, weights: [0, 0, 0.55, 0.2, 0.25, 0] },
    { slices: 15, weights: [0, 0.4, 0, 0.35, 0.25, 0] },
    { slices: 7, weights: [0, 0.5, 0, 0, 0.5, 0], tephraLayer: true },
    { slices: 18, weights: [0, 0.45, 0, 0.3, 0.25, 0] },
    { slices: 30, weights: [0.25, 0.25, 0, 0, 0.5, 0] },
  ],
  /** Two-source mixtures, each share of the first source drawn from this range. */
  mixtureCount: 14,
  mixtureShare: [0.35, 0.65],
  /** Every other slice carries a minor admixture of a second source, up to this share. */
  maxAdmixture: 0.03,
  /** Share of tephra in the slices of the tephra layer. */
  tephraShare: [0.8, 0.97],
};

/** Relative standard deviation of an analysis total around 100 %. */
const TOTAL_RSD = 0.004;

module.exports = { COLUMNS, MAJOR_OXIDES, LOADINGS, SOURCES, MEANS, LOG_SDS, CORE, TOTAL_RSD };
