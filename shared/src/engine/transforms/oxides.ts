import { InvalidInputError } from '../errors/engine-errors';

/**
 * Standard atomic weights, IUPAC/CIAAW 2021 (conventional values for the elements given as an
 * interval: O, Mg, Si). Written from memory of the CIAAW table; the test checks the factors of O, Na,
 * Mg, Al, Si, P, K, Ca, Ti, Mn and Fe against the published oxide factor table in METHODS.md §7.
 * Cr, Ni, Sr and Ba are not covered by that check.
 */
export const ATOMIC_WEIGHTS: Readonly<Record<string, number>> = {
  O: 15.999,
  Na: 22.98976928,
  Mg: 24.305,
  Al: 26.9815384,
  Si: 28.085,
  P: 30.973761998,
  K: 39.0983,
  Ca: 40.078,
  Ti: 47.867,
  Cr: 51.9961,
  Mn: 54.938043,
  Fe: 55.845,
  Ni: 58.6934,
  Ba: 137.327,
  Sr: 87.62,
};

export interface OxideFormula {
  readonly element: string;
  /** Atoms of the element per formula unit. */
  readonly elementAtoms: number;
  readonly oxygenAtoms: number;
}

/** Parses formulas of the form Eℓ[m]O[k], e.g. "SiO2", "Al2O3", "FeO", "P2O5". */
export function parseOxide(formula: string): OxideFormula {
  const match = /^([A-Z][a-z]?)(\d*)O(\d*)$/.exec(formula.trim());
  if (!match || !(match[1] in ATOMIC_WEIGHTS) || match[1] === 'O') {
    throw new InvalidInputError(`"${formula}" is not an oxide formula of a known element`);
  }
  return {
    element: match[1],
    elementAtoms: match[2] === '' ? 1 : Number(match[2]),
    oxygenAtoms: match[3] === '' ? 1 : Number(match[3]),
  };
}

function formulaMass(oxide: OxideFormula): number {
  return oxide.elementAtoms * ATOMIC_WEIGHTS[oxide.element] + oxide.oxygenAtoms * ATOMIC_WEIGHTS.O;
}

/** Mass fraction of the element in its oxide: m·A(El) / (m·A(El) + k·A(O)). */
export function oxideToElementFactor(formula: string): number {
  const oxide = parseOxide(formula);
  return (oxide.elementAtoms * ATOMIC_WEIGHTS[oxide.element]) / formulaMass(oxide);
}

/** Factor between two oxides of one element, per atom of the element (e.g. FeO → Fe₂O₃ ≈ 1.1113). */
export function oxideToOxideFactor(from: string, to: string): number {
  const a = parseOxide(from);
  const b = parseOxide(to);
  if (a.element !== b.element) throw new InvalidInputError(`"${from}" and "${to}" are oxides of different elements`);
  return formulaMass(b) / b.elementAtoms / (formulaMass(a) / a.elementAtoms);
}

/** Oxide weight per cent to element ppm (µg/g): wt % × factor × 10⁴. */
export function oxideWtPercentToElementPpm(wtPercent: number, formula: string): number {
  if (!Number.isFinite(wtPercent)) throw new InvalidInputError(`oxide value must be finite, got ${wtPercent}`);
  return wtPercent * oxideToElementFactor(formula) * 1e4;
}
