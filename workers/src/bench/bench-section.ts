/** One line of the printed table and one key of results.json. */
export interface BenchFigure {
  readonly key: string;
  readonly label: string;
  readonly value: number;
  readonly unit: string;
}

/** A benchmark section (engine, import, API, bundle, …): a name and a function that measures. */
export interface BenchSection {
  readonly name: string;
  run(log: (line: string) => void): Promise<BenchFigure[]>;
}
