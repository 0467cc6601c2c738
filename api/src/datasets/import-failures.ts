import { BadRequestException, UnprocessableEntityException } from '@nestjs/common';
import { FileRejectedError, MappingError } from './parsing/import-errors';

/** Parser failures as HTTP answers a person can act on: 422 for a file, 400 for a mapping. */
export async function asHttpErrors<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof FileRejectedError) {
      throw new UnprocessableEntityException({
        message: error.message,
        errors: [{ path: 'file', message: `${error.code}: ${error.message}` }],
      });
    }
    if (error instanceof MappingError) {
      throw new BadRequestException({
        message: 'The mapping does not fit the file',
        errors: error.problems.map((problem) => ({ path: 'mapping', message: problem })),
      });
    }
    throw error;
  }
}
