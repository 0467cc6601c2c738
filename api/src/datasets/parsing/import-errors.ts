/**
 * A file that cannot be read as a table at all (empty, binary, a damaged or oversized workbook). Distinct
 * from problems in single rows or cells, which are listed and never stop an import.
 */
export class FileRejectedError extends Error {
  constructor(
    readonly code: string,
    message: string,
  ) {
    super(message);
    this.name = 'FileRejectedError';
  }
}

/** The confirmed mapping does not fit the file (a column that is not there, two columns for one element). */
export class MappingError extends Error {
  constructor(readonly problems: string[]) {
    super(`The mapping does not fit the file: ${problems.join('; ')}`);
    this.name = 'MappingError';
  }
}
