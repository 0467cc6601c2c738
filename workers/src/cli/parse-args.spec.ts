import { UsageError } from './cli-errors';
import { parseArguments } from './parse-args';

describe('parseArguments', () => {
  const base = ['classify', '--reference', 'r.csv', '--unknowns', 'u.csv', '--out', 'o'];

  it('applies the documented defaults', () => {
    const parsed = parseArguments(base);
    expect(parsed).toMatchObject({
      command: 'classify',
      options: {
        idColumn: 'sample_id',
        groupColumn: 'group',
        elements: null,
        transform: 'none',
        covariance: 'classic',
        probability: 'chi2',
        alpha: 0.05,
      },
    });
  });

  it('reads every option, with or without "="', () => {
    const parsed = parseArguments([
      ...base,
      '--elements',
      'Cu, Zn ,Pb',
      '--transform=alr',
      '--alr-denominator',
      'Pb',
      '--alpha',
      '0.01',
      '--seed',
      '7',
      '--covariance',
      'mcd',
    ]);
    expect(parsed).toMatchObject({
      options: {
        elements: ['Cu', 'Zn', 'Pb'],
        transform: 'alr',
        alrDenominator: 'Pb',
        alpha: 0.01,
        seed: 7,
        covariance: 'mcd',
      },
    });
  });

  it.each([
    [['classify', '--reference', 'r.csv', '--out', 'o'], /--unknowns is required/],
    [[...base, '--alpha', '1.5'], /--alpha must be a number strictly between 0 and 1/],
    [[...base, '--transform', 'sqrt'], /--transform must be one of none, log10, ln, alr, clr, ilr/],
    [[...base, '--colour', 'red'], /unknown option "--colour"/],
    [[...base, '--seed'], /--seed needs a value/],
    [[...base, '--alr-denominator', 'Fe'], /only with --transform alr/],
    [['check', '--reference', 'r.csv', '--out', 'o', '--unknowns', 'u.csv'], /check takes no --unknowns/],
    [['sort'], /unknown command "sort"/],
  ])('refuses %j', (argv, message) => {
    expect(() => parseArguments(argv)).toThrow(UsageError);
    expect(() => parseArguments(argv)).toThrow(message);
  });

  it('shows help without a command', () => {
    expect(parseArguments([])).toEqual({ command: 'help' });
  });
});
