import { Injectable } from '@nestjs/common';

/**
 * Answers, for some dataset versions, what keeps them from being deleted (e.g. "study Lake basin survey,
 * signed off"); an empty list means nothing does.
 */
export type DatasetUsageCheck = (versionIds: string[]) => Promise<string[]>;

/**
 * Where other modules (the notebook's studies) say which dataset versions they depend on. A module
 * registers its check once, in onModuleInit; deleting a version asks every check first.
 */
@Injectable()
export class DatasetUsageRegistry {
  private readonly checks: DatasetUsageCheck[] = [];

  register(check: DatasetUsageCheck): void {
    this.checks.push(check);
  }

  async blockers(versionIds: string[]): Promise<string[]> {
    if (versionIds.length === 0) return [];
    const answers = await Promise.all(this.checks.map((check) => check(versionIds)));
    return answers.flat();
  }
}
