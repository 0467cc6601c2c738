import type { StepKey } from '@provenote/shared/schemas';

export interface CardHelpText {
  /** What the card does, in plain words. */
  method: string[];
  /** Where the method comes from; empty where the card applies no statistical method. */
  references: string[];
}

export const EVIDENCE_NOT_PROOF =
  'A membership probability is statistical evidence, not proof of origin: a true member falls outside its ' +
  'group at level α about α of the time, and a sample from a source with no reference group can still look ' +
  'typical of one. Weigh it with field notes, mineralogy and dating.';

const MAHALANOBIS =
  'Mahalanobis, P. C. (1936). On the generalised distance in statistics. Proc. Natl. Inst. Sci. India 2, 49–55.';
const HOTELLING =
  'Hotelling, H. (1931). The generalization of Student’s ratio. Annals of Mathematical Statistics 2, 360–378.';
const NIST_F =
  'NIST/SEMATECH e-Handbook of Statistical Methods, §6.5.4.3 Hotelling’s T squared (the F form for a new observation).';

export const cardHelp: Record<StepKey, CardHelpText> = {
  data: {
    method: [
      'Choose a version of a reference dataset (samples of known source, with their group) and a version of the unknowns.',
      'The study keeps exactly these versions. A corrected file becomes a new version and never changes a study that is already computed.',
    ],
    references: [],
  },
  prepare: {
    method: [
      'Pick the elements the distances are computed on. Each group needs clearly more members than elements: a small group with many elements gives a covariance it cannot estimate well.',
      'Concentrations are skewed and add up to a whole, so they are usually taken as logarithms or as log-ratios (alr, clr, ilr), which treat each value relative to the others.',
      'Values below the detection limit are replaced by a fraction of that limit, and flagged. The covariance is either the classic one or a robust one (minimum covariance determinant) that a few odd members cannot pull.',
    ],
    references: [
      'Aitchison, J. (1986). The Statistical Analysis of Compositional Data. Chapman & Hall.',
      'Rousseeuw, P. J. & Van Driessen, K. (1999). A fast algorithm for the minimum covariance determinant estimator. Technometrics 41, 212–223.',
    ],
  },
  groups: {
    method: [
      'Each reference group is one source area: its members’ mean and covariance describe what a typical sample of that source looks like.',
      'A study uses fixed, approved group versions, so a later change to a group does not silently change the study.',
    ],
    references: [],
  },
  check: {
    method: [
      'Every member is left out of its group in turn and assigned as if it were an unknown. A group whose own members often fall outside it, or land in another group, is too wide, mixed or too small.',
      'Each pair of groups is tested for different means (two-sample Hotelling T²), and each element for differences between groups by ranks (Kruskal–Wallis), to show which elements carry the separation.',
    ],
    references: [
      MAHALANOBIS,
      HOTELLING,
      'Kruskal, W. H. & Wallis, W. A. (1952). Use of ranks in one-criterion variance analysis. JASA 47, 583–621.',
    ],
  },
  assign: {
    method: [
      'For each unknown the Mahalanobis distance D² to every group is computed: the distance from the group mean, measured in units of the group’s own spread and correlations.',
      'The distance becomes a probability of membership, either from the chi-square distribution or, better for small groups, from the F distribution of Hotelling’s T² for a new observation. Above α the sample fits that group; fitting two groups is ambiguous; fitting none is unassigned.',
    ],
    references: [MAHALANOBIS, NIST_F, HOTELLING],
  },
  review: {
    method: [
      'Read the verdicts beside the probabilities and the elements that drive each distance. Where other evidence says otherwise, override a verdict and write why: the computed verdict and the reason stay in the record.',
      'The PI signs the study off; after that nothing in it can change.',
    ],
    references: [],
  },
  export: {
    method: [
      'A bundle holds the data versions, every card’s settings, the results, the overrides and a checksum of each file, so anyone can check the study without Provenote.',
    ],
    references: [],
  },
};
