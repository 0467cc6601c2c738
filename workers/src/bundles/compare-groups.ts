import type { BundleManifest } from '@provenote/shared';
import {
  GROUP_COVARIANCE_FILE,
  GROUP_MEAN_FILE,
  GROUP_MEMBERS_FILE,
  GROUP_ROBUST_FILE,
  MANIFEST_PATH,
} from './bundle-layout';
import type { GroupContent } from './bundle-content';
import { parseCsv, type CsvTable } from './csv';
import type { MismatchLog } from './mismatch-log';

interface RobustFile {
  seed: number;
  h: number;
  consistencyFactor: number;
  cutoff: number;
  members: { sampleId: string; robustD2: number; inSupport: boolean }[];
}

function table(log: MismatchLog, files: ReadonlyMap<string, Buffer>, path: string, header: string[]): CsvTable | null {
  const bytes = files.get(path);
  if (!bytes) return null;
  try {
    return parseCsv(bytes.toString('utf8'), path, header);
  } catch (error) {
    log.add(path, (error as Error).message);
    return null;
  }
}

function compareRobust(
  log: MismatchLog,
  path: string,
  bytes: Buffer | undefined,
  group: Omit<GroupContent, 'version'>,
): void {
  const robust = group.robust;
  if (!robust) return;
  if (!bytes) return log.add(path, `missing: group "${group.name}" was fitted robustly`);
  let file: RobustFile;
  try {
    file = JSON.parse(bytes.toString('utf8')) as RobustFile;
  } catch (error) {
    return log.add(path, `not valid JSON: ${(error as Error).message}`);
  }
  log.number(path, 'seed', robust.seed, file.seed, 'exact');
  log.number(path, 'h', robust.h, file.h, 'exact');
  log.number(path, 'consistencyFactor', robust.consistencyFactor, file.consistencyFactor, 'relative');
  log.number(path, 'cutoff', robust.cutoff, file.cutoff, 'relative');
  if (!Array.isArray(file.members) || file.members.length !== group.members.length) {
    return log.add(path, `lists ${file.members?.length ?? 0} members; the group has ${group.members.length}`);
  }
  file.members.forEach((member, i) => {
    log.text(path, `member ${i + 1}, sampleId`, group.members[i], String(member.sampleId));
    log.number(path, `member ${i + 1}, robustD2`, robust.distances[i], member.robustD2, 'relative');
    log.text(path, `member ${i + 1}, inSupport`, String(robust.support[i]), String(member.inSupport));
  });
}

/** Each group's entry in the manifest and its files against the group refitted from the prepared data. */
export function compareGroups(
  log: MismatchLog,
  files: ReadonlyMap<string, Buffer>,
  manifest: BundleManifest,
  groups: readonly Omit<GroupContent, 'version'>[],
): void {
  const listed = new Map(manifest.groups.map((group) => [group.name, group]));
  for (const group of groups) {
    const entry = listed.get(group.name);
    if (!entry) {
      log.add(MANIFEST_PATH, `group "${group.name}" has reference samples in the prepared data but no entry`);
      continue;
    }
    listed.delete(group.name);
    const where = `group "${group.name}"`;
    log.number(MANIFEST_PATH, `${where}, n`, group.n, entry.n, 'exact');
    log.number(MANIFEST_PATH, `${where}, effectiveN`, group.effectiveN, entry.effectiveN, 'exact');
    log.text(MANIFEST_PATH, `${where}, covariance`, group.method, entry.covariance);

    const membersPath = `${entry.directory}/${GROUP_MEMBERS_FILE}`;
    const members = table(log, files, membersPath, ['sample_id']);
    if (members)
      log.text(membersPath, 'member list', group.members.join(', '), members.rows.map((r) => r[0]).join(', '));

    const meanPath = `${entry.directory}/${GROUP_MEAN_FILE}`;
    const mean = table(log, files, meanPath, ['variable', 'mean']);
    if (mean) {
      log.text(meanPath, 'variables', group.variables.join(', '), mean.rows.map((r) => r[0]).join(', '));
      group.mean.forEach((value, j) => j < mean.rows.length && log.cell(meanPath, mean, j, 'mean', value, 'relative'));
    }

    const covariancePath = `${entry.directory}/${GROUP_COVARIANCE_FILE}`;
    const covariance = table(log, files, covariancePath, ['variable', ...group.variables]);
    if (covariance) {
      if (covariance.rows.length !== group.variables.length) {
        log.add(covariancePath, `has ${covariance.rows.length} rows for ${group.variables.length} variables`);
      } else {
        group.covariance.forEach((row, j) =>
          row.forEach((value, k) => log.cell(covariancePath, covariance, j, group.variables[k], value, 'relative')),
        );
      }
    }
    compareRobust(
      log,
      `${entry.directory}/${GROUP_ROBUST_FILE}`,
      files.get(`${entry.directory}/${GROUP_ROBUST_FILE}`),
      group,
    );
  }
  for (const name of listed.keys())
    log.add(MANIFEST_PATH, `group "${name}" is listed but has no reference samples in the prepared data`);
}
