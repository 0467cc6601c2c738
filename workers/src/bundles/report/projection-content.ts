import type { ProjectionMethod, StoredProjection } from '@provenote/shared';
import type { ProjectionContent } from '../bundle-content';

/** The report draws one coverage; 0.95 is the level the notebook opens with. */
export const REPORT_ELLIPSE_LEVEL = 0.95;

const TITLES: Record<ProjectionMethod, string> = {
  pca: 'Principal components of the reference samples',
  cv: 'Canonical variates of the reference groups',
};

/** What an axis's share is a share of, per method. */
const SHARE_OF: Record<ProjectionMethod, string> = {
  pca: 'of the variance',
  cv: 'of the between-group separation',
};

const percent = (share: number) => `${(share * 100).toFixed(1)} %`;

/**
 * One stored projection as the report draws it: reference samples and unknowns, and each group's
 * ellipse at REPORT_ELLIPSE_LEVEL. A run that stored no projection of this method (older runs) gets
 * the reason instead of a figure.
 */
export function projectionContent(method: ProjectionMethod, stored: StoredProjection | undefined): ProjectionContent {
  const title = TITLES[method];
  const empty = { xLabel: '', yLabel: '', points: [], ellipses: [], notes: [] };
  if (!stored) return { title, unavailable: 'the assign run stored no such projection', ...empty };
  if (stored.unavailable !== null) return { title, unavailable: stored.unavailable, ...empty };
  if (stored.axes.length !== 2) {
    throw new Error(`the stored ${method} projection has ${stored.axes.length} axes; a plane needs two`);
  }
  const [xAxis, yAxis] = stored.axes.map((axis) => `${axis.label} (${percent(axis.share)} ${SHARE_OF[method]})`);
  const key = String(REPORT_ELLIPSE_LEVEL);
  const ellipses = stored.groups.flatMap((group) => {
    const outline = group.ellipses?.[key];
    return outline ? [{ group: group.name, level: REPORT_ELLIPSE_LEVEL, x: outline.x, y: outline.y }] : [];
  });
  const law =
    stored.ellipseBasis === 'f'
      ? 'the region a new sample of the group falls in with that probability (F law, wider for small groups)'
      : 'the χ²₂ region of the group';
  const notes = [
    `Ellipses: ${percent(REPORT_ELLIPSE_LEVEL)} coverage, ${law}, from the mean and covariance the distances use.`,
    ...stored.groups
      .filter((group) => !group.ellipses?.[key])
      .map((group) => `No ellipse for ${group.name}: ${group.ellipseNote ?? `no ${key} outline was stored`}.`),
    ...(stored.unknownTotal > stored.unknowns.length
      ? [`The first ${stored.unknowns.length} of ${stored.unknownTotal} unknown samples are drawn.`]
      : []),
  ];
  return {
    title,
    unavailable: null,
    xLabel: xAxis,
    yLabel: yAxis,
    points: [
      ...stored.reference.map((p) => ({
        sampleId: p.sampleId,
        role: 'reference' as const,
        group: p.group,
        x: p.x,
        y: p.y,
      })),
      ...stored.unknowns.map((p) => ({ sampleId: p.sampleId, role: 'unknown' as const, group: null, x: p.x, y: p.y })),
    ],
    ellipses,
    notes,
  };
}
