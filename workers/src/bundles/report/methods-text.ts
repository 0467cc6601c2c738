import type { BundleContent } from '../bundle-content';

const TRANSFORM_TEXT: Record<string, string> = {
  none: 'Concentrations were used as measured, without a transform.',
  log10: 'Concentrations were transformed to base-10 logarithms.',
  ln: 'Concentrations were transformed to natural logarithms.',
  alr: 'Compositions were expressed as additive log-ratios to {denominator} (Aitchison 1986).',
  clr: 'Compositions were expressed as centred log-ratios (Aitchison 1986); distances were computed in the equivalent pivot (isometric log-ratio) coordinates, which give the pseudo-inverse distance of the singular centred log-ratio covariance (Egozcue et al. 2003).',
  ilr: 'Compositions were expressed in isometric log-ratio pivot coordinates (Aitchison 1986; Egozcue et al. 2003).',
};

const BELOW_DETECTION_TEXT: Record<string, string> = {
  'dl-half': 'half the detection limit (Hornung & Reed 1990)',
  'dl-sqrt2': 'the detection limit divided by √2 (Hornung & Reed 1990)',
  multiplicative: 'multiplicative replacement (Martín-Fernández, Barceló-Vidal & Pawlowsky-Glahn 2003)',
};

/** Each reference with the citation the methods paragraph writes for it. */
const REFERENCES: readonly { readonly cited: string; readonly entry: string }[] = [
  {
    cited: 'Aitchison 1986',
    entry: 'Aitchison, J. (1986). The Statistical Analysis of Compositional Data. Chapman & Hall.',
  },
  {
    cited: 'Egozcue et al. 2003',
    entry:
      'Egozcue, J. J., Pawlowsky-Glahn, V., Mateu-Figueras, G. & Barceló-Vidal, C. (2003). Isometric logratio transformations for compositional data analysis. Mathematical Geology 35:279–300.',
  },
  {
    cited: 'Hornung & Reed 1990',
    entry:
      'Hornung, R. W. & Reed, L. D. (1990). Estimation of average concentration in the presence of nondetectable values. Applied Occupational and Environmental Hygiene 5:46–51.',
  },
  {
    cited: 'Hotelling 1931',
    entry: 'Hotelling, H. (1931). The generalization of Student’s ratio. Annals of Mathematical Statistics 2:360–378.',
  },
  {
    cited: 'Mahalanobis 1936',
    entry:
      'Mahalanobis, P. C. (1936). On the generalised distance in statistics. Proceedings of the National Institute of Sciences of India 2:49–55.',
  },
  {
    cited: 'Martín-Fernández, Barceló-Vidal & Pawlowsky-Glahn 2003',
    entry:
      'Martín-Fernández, J. A., Barceló-Vidal, C. & Pawlowsky-Glahn, V. (2003). Dealing with zeros and missing values in compositional data sets using nonparametric imputation. Mathematical Geology 35:253–278.',
  },
  {
    cited: 'NIST/SEMATECH e-Handbook',
    entry: 'NIST/SEMATECH e-Handbook of Statistical Methods, §6.5.4.3, Hotelling’s T squared.',
  },
  {
    cited: 'Rousseeuw & Van Driessen 1999',
    entry:
      'Rousseeuw, P. J. & Van Driessen, K. (1999). A fast algorithm for the minimum covariance determinant estimator. Technometrics 41:212–223.',
  },
];

/** The methods paragraph, written from the run's parameters. */
export function methodsParagraph(content: BundleContent): string {
  const { parameters, seed } = content;
  const imputed = content.prepared.some((value) => value.flag === 'imputed');
  const sentences = [
    `Samples were compared on ${parameters.elements.length} elements (${parameters.elements.join(', ')}).`,
    imputed
      ? `Values below the detection limit were replaced by ${BELOW_DETECTION_TEXT[parameters.belowDetection]} and stay flagged as imputed in the prepared data.`
      : 'No value needed replacing for being below the detection limit.',
    TRANSFORM_TEXT[parameters.transform].replace(
      '{denominator}',
      parameters.alrDenominator ?? parameters.elements[parameters.elements.length - 1],
    ),
    parameters.covariance === 'mcd'
      ? `Each reference group's mean and covariance were estimated robustly by the reweighted minimum covariance determinant, FAST-MCD (Rousseeuw & Van Driessen 1999), with random seed ${seed}.`
      : "Each reference group's mean and unbiased covariance were estimated from all its members.",
    'The squared Mahalanobis distance D² (Mahalanobis 1936) of every sample to every group was computed through a Cholesky factor of the group covariance.',
    'Membership probabilities were computed both from the chi-square distribution with p degrees of freedom and from the F distribution for a new observation, F = n(n−p)/(p(n+1)(n−1))·D² on (p, n−p) degrees of freedom (NIST/SEMATECH e-Handbook §6.5.4.3).',
    `A sample was assigned when exactly one group reached a ${parameters.probability === 'chi2' ? 'chi-square' : 'F-based (Hotelling)'} membership probability of at least α = ${parameters.alpha}, ambiguous when two or more did, and unassigned when none did.`,
    'Each reference member was also judged with itself left out of its own group (closed-form leave-one-out), and each pair of groups was compared by the two-sample Hotelling T² (Hotelling 1931).',
  ];
  return sentences.join(' ');
}

/**
 * The references the methods paragraph cites, and only those: a run on natural logs with the classical
 * covariance cites no log-ratio, zero-replacement or robust-covariance paper.
 */
export function citedReferences(paragraph: string): string[] {
  return REFERENCES.filter((reference) => paragraph.includes(reference.cited)).map((reference) => reference.entry);
}
