import type { BundleContent } from './bundle-content';
import { TOLERANCE_TEXT } from './tolerance';

/** README.txt: what each file is and how to check the bundle, in plain text for any reader. */
export function readmeText(content: BundleContent): string {
  const robust = content.groups.some((group) => group.method === 'mcd');
  return [
    `Provenote result bundle: ${content.study.title}`,
    `Lab: ${content.lab.name}. Made by ${content.createdBy.name} on ${content.createdAt}.`,
    content.signOff
      ? `Signed off by ${content.signOff.by.name} on ${content.signOff.at} (statement in manifest.json).`
      : 'Not signed off: built outside a signed-off study.',
    `Provenote ${content.provenoteVersion}, engine ${content.engineVersion}.`,
    '',
    'A membership probability is statistical evidence that a sample is typical of a reference group,',
    'not proof of its origin.',
    '',
    'FILES',
    '  manifest.json          versions, time, who, lab and study, the sign-off (who, when, statement),',
    '                         every parameter, the reference group versions, the random seed, and the',
    '                         SHA-256 and size of every other file.',
    '  report.html            the report: study, methods, groups, assignments and the main projections.',
    '                         It opens offline in any browser.',
    '  inputs/raw/            the uploaded files, byte for byte.',
    '  inputs/prepared.csv    the data as used: one row per sample and element (sample_id, role, group,',
    '                         element, value_ppm after normalisation and imputation, transformed_value,',
    '                         flag = measured or imputed).',
    '  groups/<group>/        members.csv (member sample ids), mean.csv (mean vector), covariance.csv',
    '                         (covariance matrix), in the coordinates distances are computed in.',
    ...(robust
      ? [
          '                         robust-fit.json: the FAST-MCD seed, h, consistency factor, cut-off',
          "                         and each member's robust distance and whether the fit kept it.",
        ]
      : []),
    '  results/distances.csv  sample_id,group,d2,p_chi2,p_hotelling: every unknown against every group.',
    '  results/assignments.csv',
    '                         sample_id,verdict,group,probability,runner_up,runner_up_probability as',
    '                         computed, then final_verdict,final_group,override_reason after review.',
    '  results/contributions.csv',
    '                         sample_id,group,variable,contribution: for each unknown, the share of its',
    '                         D² to its best group from each distance coordinate (they sum to d2); the',
    '                         sequential split of Mason, Tracy & Young 1995, in the order of mean.csv.',
    '  results/members.csv    sample_id,group,d2,d2_loo,p_hotelling_loo,verdict_loo: each member of each',
    '                         reference group left out of its own group.',
    '  results/separation.csv group_a,group_b,t2,f,df1,df2,p: two-sample Hotelling T² per pair of groups.',
    '',
    'Numbers are written at full precision. Text cells that a spreadsheet could take for a formula',
    '(starting with =, +, -, @, a tab or a carriage return) carry a leading apostrophe.',
    '',
    'HOW TO VERIFY',
    '  With Provenote:  npm run cli -- verify BUNDLE.zip',
    '  It checks that the archive holds exactly the files the manifest lists (unsafe names such as ../x',
    '  are refused), that every SHA-256 matches, and recomputes the groups and results from',
    "  inputs/prepared.csv with the manifest's parameters and seed. It exits 0 only when all match.",
    `  Tolerances: ${TOLERANCE_TEXT}`,
    '  Without Provenote: compare `sha256sum` of each file with manifest.json.',
    '',
  ].join('\r\n');
}
