import { createHash } from 'node:crypto';
import { Injectable, UnprocessableEntityException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type EntityManager, type EntityTarget, type ObjectLiteral } from 'typeorm';
import type { QueryDeepPartialEntity } from 'typeorm/query-builder/QueryPartialEntity';
import {
  defaultStepParameters,
  prepareStepParametersSchema,
  stepKeys,
  type BundleManifest,
  type OpenedBundle,
  type StepStatus,
} from '@provenote/shared';
import { readZipEntries, verifyBundle, type BundleVerification } from '@provenote/workers';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { RunAssignmentEntity } from '../runs/run-assignment.entity';
import { RunCheckMemberEntity } from '../runs/run-check-member.entity';
import { RunCheckPairEntity } from '../runs/run-check-pair.entity';
import { RunGroupEntity } from '../runs/run-group.entity';
import { writeRunInputs } from '../runs/run-inputs.writer';
import { RunEntity } from '../runs/run.entity';
import { StudyOverrideEntity } from '../studies/study-override.entity';
import { StudyStepEntity } from '../studies/study-step.entity';
import { StudyEntity } from '../studies/study.entity';
import { BundleEntity } from './bundle.entity';
import { BundlesService } from './bundles.service';
import { restoreCheck, restoreContributions, type RestoredCheck } from './restore-check';
import { restorePlan, type RestorePlan } from './restore-plan';

const NAME_LIMIT = 200;
const RESTORED_SUFFIX = ' (restored bundle)';

const verificationView = (v: BundleVerification) => ({
  ok: v.ok,
  filesChecked: v.filesChecked,
  valuesCompared: v.valuesCompared,
  problems: v.problems,
});

/** The notebook's Prepare settings from the manifest, when they fit that card's schema. */
function prepareParameters(manifest: BundleManifest) {
  const { parameters, seed } = manifest;
  const parsed = prepareStepParametersSchema.safeParse({
    elements: parameters.elements,
    transform: parameters.transform,
    alrDenominator: parameters.alrDenominator ?? null,
    belowDetection: parameters.belowDetection,
    covariance: parameters.covariance,
    seed,
  });
  return parsed.success ? parsed.data : null;
}

/**
 * Opening a bundle: the same verification as `npm run cli -- verify`, then, only when every file and
 * value matched, the study restored in the lab as a signed-off (so read-only) study with the bundle's
 * group check, assign results and reviewed verdicts. A bundle that does not verify is answered 422 and stores nothing.
 */
@Injectable()
export class BundleRestoreService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly bundles: BundlesService,
    private readonly audit: AuditService,
  ) {}

  async open(labId: string, user: AuthUser, filename: string, zip: Buffer): Promise<OpenedBundle> {
    const verification = await verifyBundle(zip);
    if (!verification.ok || !verification.manifest) {
      const count = verification.problems.length;
      throw new UnprocessableEntityException({
        message: `The bundle does not verify (${count} ${count === 1 ? 'problem' : 'problems'}); nothing was restored`,
        errors: verification.problems.map((problem) => ({
          path: problem.path ?? '(archive)',
          message: `${problem.kind}: ${problem.message}`,
        })),
      });
    }
    const manifest = verification.manifest;
    const files = new Map((await readZipEntries(zip)).map((entry) => [entry.name, entry.bytes]));
    const plan = restorePlan(files, manifest);
    const check = restoreCheck(files, manifest, plan.inputs, plan.variables);
    const contributions = restoreContributions(files, plan.variables);
    const sha256 = createHash('sha256').update(zip).digest('hex');
    const { studyId, studyName, bundleId } = await this.dataSource.transaction(async (manager) => {
      const study = await this.insertStudy(manager, labId, user, manifest, filename, sha256);
      const runId = await this.insertAssignRun(manager, labId, study.id, user, manifest, plan, contributions);
      const checkRunId = check
        ? await this.insertCheckRun(manager, labId, study.id, user, manifest, plan, check)
        : null;
      await this.insertSteps(manager, study.id, { assign: runId, check: checkRunId }, user, manifest);
      await manager.getRepository(StudyOverrideEntity).insert(
        plan.overrides.map((o) => ({
          studyId: study.id,
          runId,
          sampleId: o.sampleId,
          computedVerdict: o.computedVerdict,
          computedGroup: o.computedGroup,
          verdict: o.verdict,
          groupName: o.group,
          reason: o.reason,
          createdById: user.id,
        })),
      );
      const bundle = await manager.getRepository(BundleEntity).save({
        labId,
        studyId: study.id,
        origin: 'uploaded' as const,
        runId: null,
        sourceRunId: null,
        filename,
        content: zip,
        sizeBytes: zip.byteLength,
        sha256,
        manifest,
        createdById: user.id,
      });
      await this.audit.record(
        {
          labId,
          actor: user,
          action: 'bundle.restored',
          target: { type: 'study', id: study.id },
          details: {
            bundleId: bundle.id,
            filename,
            sha256,
            fromLab: manifest.lab.name,
            fromStudy: manifest.study.title,
          },
        },
        manager,
      );
      return { studyId: study.id, studyName: study.name, bundleId: bundle.id };
    });
    return {
      verification: verificationView(verification),
      studyId,
      studyName,
      bundle: await this.bundles.get(labId, bundleId),
    };
  }

  private insertStudy(
    manager: EntityManager,
    labId: string,
    user: AuthUser,
    manifest: BundleManifest,
    filename: string,
    sha256: string,
  ) {
    const now = new Date();
    return manager.getRepository(StudyEntity).save({
      labId,
      name: manifest.study.title.slice(0, NAME_LIMIT - RESTORED_SUFFIX.length) + RESTORED_SUFFIX,
      description: manifest.study.description,
      ownerId: user.id,
      signedOffAt: now,
      signedOffById: user.id,
      // The lock is the restoring user's; the original sign-off (absent in older bundles) is quoted.
      signOffStatement:
        `Restored read-only from the verified result bundle ${filename} (SHA-256 ${sha256}), ` +
        `built ${manifest.createdAt} by ${manifest.createdBy.name} in ${manifest.lab.name}.` +
        (manifest.signOff
          ? ` Signed off there by ${manifest.signOff.by.name} at ${manifest.signOff.at}: "${manifest.signOff.statement}"`
          : ''),
    });
  }

  private async insertAssignRun(
    manager: EntityManager,
    labId: string,
    studyId: string,
    user: AuthUser,
    manifest: BundleManifest,
    plan: RestorePlan,
    contributions: ReadonlyMap<string, number[]>,
  ): Promise<string> {
    const run = await this.insertRun(manager, labId, studyId, user, manifest, plan, 'classify', {
      variables: plan.variables,
      restoredFromBundle: true,
    });
    const rows = plan.assignments.map((a) => ({
      runId: run.id,
      ordinal: a.ordinal,
      sampleId: a.sampleId,
      verdict: a.verdict,
      groupName: a.group,
      probability: a.probability,
      runnerUp: a.runnerUp,
      runnerUpProbability: a.runnerUpProbability,
      d2: a.d2,
      pChi2: a.pChi2,
      pHotelling: a.pHotelling,
      // Bundles made before results/contributions.csv do not carry them; an empty list says so rather than inventing them.
      contributions: contributions.get(a.sampleId) ?? [],
    }));
    await insertInSlices(manager, RunAssignmentEntity, rows);
    return run.id;
  }

  /** The check run the Group check card reads: its members, separation of groups and summary. */
  private async insertCheckRun(
    manager: EntityManager,
    labId: string,
    studyId: string,
    user: AuthUser,
    manifest: BundleManifest,
    plan: RestorePlan,
    check: RestoredCheck,
  ): Promise<string> {
    const run = await this.insertRun(manager, labId, studyId, user, manifest, plan, 'group-check', check.summary);
    const members = check.members.map((member) => ({ runId: run.id, ...member }));
    await insertInSlices(manager, RunCheckMemberEntity, members);
    await manager.getRepository(RunCheckPairEntity).insert(check.pairs.map((pair) => ({ runId: run.id, ...pair })));
    return run.id;
  }

  /** A succeeded run with the bundle's parameters, inputs and groups. */
  private async insertRun(
    manager: EntityManager,
    labId: string,
    studyId: string,
    user: AuthUser,
    manifest: BundleManifest,
    plan: RestorePlan,
    kind: 'classify' | 'group-check',
    summary: Record<string, unknown>,
  ) {
    const now = new Date();
    const run = await manager.getRepository(RunEntity).save({
      labId,
      studyId,
      kind,
      status: 'succeeded' as const,
      progress: 1,
      phase: 'restored from a bundle',
      parameters: { ...manifest.parameters, seed: manifest.seed },
      seed: manifest.seed,
      summary,
      createdBy: user.id,
      startedAt: now,
      finishedAt: now,
    });
    const p = manifest.parameters.elements.length;
    // The check run reads only the reference; the assign run both.
    const roles = kind === 'classify' ? (['reference', 'unknown'] as const) : (['reference'] as const);
    for (const role of roles) {
      const samples = plan.inputs
        .filter((input) => input.role === role)
        .map((input) => ({ sampleId: input.sampleId, group: input.group ?? undefined, values: input.values }));
      await writeRunInputs(manager, run.id, role, samples, p);
    }
    await manager
      .getRepository(RunGroupEntity)
      .insert(
        plan.groups.map((group, groupIndex) => ({ runId: run.id, groupIndex, ...group, variables: plan.variables })),
      );
    return run;
  }

  /** Prepare, Group check, Assign and Review as the bundle records them; the cards whose inputs stayed behind are left unrun. */
  private async insertSteps(
    manager: EntityManager,
    studyId: string,
    runIds: { assign: string; check: string | null },
    user: AuthUser,
    manifest: BundleManifest,
  ) {
    const prepare = prepareParameters(manifest);
    const restored: Partial<Record<(typeof stepKeys)[number], { status: StepStatus; parameters: object | null }>> = {
      prepare: { status: prepare ? 'current' : 'not_run', parameters: prepare },
      ...(runIds.check ? { check: { status: 'current' as const, parameters: defaultStepParameters.check } } : {}),
      assign: {
        status: 'current',
        parameters: { probability: manifest.parameters.probability, alpha: manifest.parameters.alpha },
      },
      review: { status: 'current', parameters: {} },
    };
    await manager.getRepository(StudyStepEntity).insert(
      stepKeys.map((key, position) => ({
        studyId,
        key,
        position,
        status: restored[key]?.status ?? ('not_run' as const),
        parameters: restored[key]?.parameters ?? defaultStepParameters[key],
        runId: key === 'assign' ? runIds.assign : key === 'check' ? runIds.check : null,
        updatedById: user.id,
      })),
    );
  }
}

/** Inserts rows 500 at a time, keeping each statement well under PostgreSQL's 65,535 bind parameters. */
async function insertInSlices<T extends ObjectLiteral>(
  manager: EntityManager,
  entity: EntityTarget<T>,
  rows: QueryDeepPartialEntity<T>[],
): Promise<void> {
  for (let from = 0; from < rows.length; from += 500) {
    await manager.getRepository(entity).insert(rows.slice(from, from + 500));
  }
}
