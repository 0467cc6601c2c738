import { ConflictException, ForbiddenException, NotFoundException } from '@nestjs/common';
import type { AuthUser, LabMembership } from '../auth/auth.types';
import type { StudyEntity } from './study.entity';

export const STUDY_NOT_FOUND = 'Study not found';
export const STUDY_SIGNED_OFF =
  'This study is signed off: its inputs, settings and results are locked. Copy it to work on.';

export function requireStudy(study: StudyEntity | null): StudyEntity {
  if (!study) throw new NotFoundException(STUDY_NOT_FOUND);
  return study;
}

/** Every write to a study goes through here: a signed-off study never changes. */
export function assertWritable(study: StudyEntity): void {
  if (study.signedOffAt) throw new ConflictException(STUDY_SIGNED_OFF);
}

/** Students work on their own studies; analysts and PIs on every study of the lab. */
export function assertMayEdit(study: StudyEntity, membership: LabMembership, user: AuthUser): void {
  assertWritable(study);
  if (membership.role === 'student' && study.ownerId !== user.id) {
    throw new ForbiddenException('Students may change only the studies they own; copy this one to work on it');
  }
}
