import type { AssignmentRow, BundleContent } from '../bundle-content';
import { escapeHtml, formatNumber } from './html';
import { citedReferences, methodsParagraph } from './methods-text';
import { scatterSvg } from './scatter-svg';

/** Beyond this many unknowns the report lists the first ones and points to results/assignments.csv. */
export const REPORT_ASSIGNMENT_ROWS = 2000;

export const CAUTION =
  'A membership probability is statistical evidence that a sample is typical of a reference group, not proof of its origin.';

const STYLE = `
body{font:15px/1.5 system-ui,sans-serif;color:#1d232a;max-width:60rem;margin:2rem auto;padding:0 1rem}
h1{font-size:1.6rem;margin-bottom:.2rem}h2{font-size:1.2rem;margin-top:2rem;border-bottom:1px solid #d7dde3}
.meta{color:#56606b}.caution{border-left:4px solid #c77700;background:#fff6e5;padding:.6rem 1rem}
table{border-collapse:collapse;font-size:.9rem;margin:.5rem 0}th,td{padding:.25rem .6rem;border-bottom:1px solid #e3e7eb;text-align:left}
td.num{text-align:right;font-variant-numeric:tabular-nums}td.num,td.id{white-space:nowrap}svg{max-width:100%;height:auto;font-size:11px}
svg .grid{stroke:#e3e7eb}svg .frame{fill:none;stroke:#8a949e}.override{color:#8a3b00}
`;

/** How a column's cells are set: numbers right-aligned, and neither numbers nor sample ids broken across lines. */
type Column = 'text' | 'num' | 'id';

function table(headers: string[], rows: string[][], columns: Column[]): string {
  const head = headers.map((h) => `<th>${escapeHtml(h)}</th>`).join('');
  const cellClass = (column: Column) => (column === 'text' ? '' : ` class="${column}"`);
  const body = rows
    .map((row) => `<tr>${row.map((cell, j) => `<td${cellClass(columns[j])}>${cell}</td>`).join('')}</tr>`)
    .join('');
  return `<table><thead><tr>${head}</tr></thead><tbody>${body}</tbody></table>`;
}

function groupSection(content: BundleContent): string {
  const rows = content.groups.map((g) => [
    escapeHtml(g.name),
    String(g.version),
    String(g.n),
    String(g.effectiveN),
    g.method === 'mcd' ? 'robust (FAST-MCD)' : 'classical',
  ]);
  const separation = content.results.separation.map((s) => [
    escapeHtml(s.groupA),
    escapeHtml(s.groupB),
    formatNumber(s.t2),
    formatNumber(s.f),
    `${s.df1}, ${s.df2}`,
    formatNumber(s.p),
  ]);
  const loo = content.results.members;
  const returned = loo.filter((m) => m.verdictLoo === 'own_group').length;
  return [
    '<h2>Reference groups</h2>',
    table(['Group', 'Version', 'Members', 'Members in the estimate', 'Covariance'], rows, [
      'text',
      'num',
      'num',
      'num',
      'text',
    ]),
    loo.length > 0
      ? `<p>Left out of their own group, ${returned} of ${loo.length} members were assigned back to it.</p>`
      : '',
    separation.length > 0
      ? '<h3>Separation of the groups (two-sample Hotelling T²)</h3>' +
        table(['Group A', 'Group B', 'T²', 'F', 'df', 'p'], separation, ['text', 'text', 'num', 'num', 'num', 'num'])
      : '',
  ].join('');
}

function overrideAuthor(a: AssignmentRow): string {
  if (!a.overriddenBy || !a.overriddenAt) {
    throw new Error(`the override of ${a.sampleId} does not say who made it and when`);
  }
  return ` (overridden by ${escapeHtml(a.overriddenBy)}, ${escapeHtml(a.overriddenAt)})`;
}

/** The study's standing: a bundle is made from a signed-off study, so the report says by whom and when. */
function statusParagraph(content: BundleContent): string {
  const { signOff } = content;
  if (!signOff)
    return '<p class="status"><strong>Not signed off.</strong> This bundle was built outside a signed-off study.</p>';
  const statement = signOff.statement.trim()
    ? ` Sign-off statement: “${escapeHtml(signOff.statement.trim())}”`
    : ' The sign-off gave no statement.';
  return `<p class="status"><strong>Signed off</strong> by ${escapeHtml(signOff.by.name)} on ${escapeHtml(signOff.at)}; no result of the study can change after sign-off.${statement}</p>`;
}

function assignmentSection(content: BundleContent): string {
  const all = content.results.assignments;
  if (all.length === 0) return '<h2>Assignments</h2><p>This run assigned no unknown samples.</p>';
  const shown = all.slice(0, REPORT_ASSIGNMENT_ROWS);
  const rows = shown.map((a) => {
    const overridden = a.overrideReason !== null && a.overrideReason !== '';
    const final = `${a.finalVerdict}${a.finalGroup ? ` (${escapeHtml(a.finalGroup)})` : ''}`;
    return [
      escapeHtml(a.sampleId),
      a.verdict,
      escapeHtml(a.group),
      formatNumber(a.probability),
      escapeHtml(a.runnerUp ?? ''),
      formatNumber(a.runnerUpProbability),
      overridden
        ? `<span class="override">${final}: ${escapeHtml(a.overrideReason ?? '')}${overrideAuthor(a)}</span>`
        : final,
    ];
  });
  const counts = ['assigned', 'ambiguous', 'unassigned'].map(
    (v) => `${all.filter((a) => a.finalVerdict === v).length} ${v}`,
  );
  return [
    '<h2>Assignments</h2>',
    `<p>${all.length} unknown samples: ${counts.join(', ')} after review.</p>`,
    table(
      [
        'Sample',
        'Computed verdict',
        'Best group',
        'Probability',
        'Runner-up',
        'Runner-up probability',
        'Final verdict',
      ],
      rows,
      ['id', 'text', 'text', 'num', 'text', 'num', 'text'],
    ),
    all.length > shown.length
      ? `<p>The first ${shown.length} of ${all.length} are shown; every one is in results/assignments.csv.</p>`
      : '',
  ].join('');
}

/** report.html: one self-contained page (inline style and SVG, no script, no outside resource). */
export function renderReport(content: BundleContent): string {
  const { study, lab, createdBy, createdAt } = content;
  const groupNames = content.groups.map((g) => g.name);
  const methods = methodsParagraph(content);
  const projections = (content.projections ?? []).map((projection) =>
    projection.unavailable !== null
      ? `<h2>${escapeHtml(projection.title)}</h2><p>Not drawn: ${escapeHtml(projection.unavailable)}.</p>`
      : `<h2>${escapeHtml(projection.title)}</h2><figure>${scatterSvg(projection, groupNames)}<figcaption>${projection.notes
          .map(escapeHtml)
          .join(' ')}</figcaption></figure>`,
  );
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline'">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(study.title)} — Provenote report</title><style>${STYLE}</style></head>
<body>
<h1>${escapeHtml(study.title)}</h1>
<p class="meta">${escapeHtml(lab.name)} · prepared by ${escapeHtml(createdBy.name)} · ${escapeHtml(createdAt)} · Provenote ${escapeHtml(content.provenoteVersion)}, engine ${escapeHtml(content.engineVersion)}</p>
<p class="caution" role="note">${CAUTION}</p>
<h2>Study</h2>${statusParagraph(content)}
<p>Description, as written for the study: ${escapeHtml(study.description || 'none was given.')}</p>
<h2>Methods</h2><p>${escapeHtml(methods)}</p>
${groupSection(content)}
${assignmentSection(content)}
${projections.join('\n')}
<h2>References</h2><ul>${citedReferences(methods)
    .map((r) => `<li>${escapeHtml(r)}</li>`)
    .join('')}</ul>
<p class="meta">Every number here is in the bundle's CSV files at full precision; README.txt explains how to verify them.</p>
</body></html>
`;
}
