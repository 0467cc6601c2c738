import type { Study, Step } from '@provenote/shared/schemas';

/** What each card body gets from the notebook. */
export interface CardProps {
  labId: string;
  study: Study;
  step: Step;
  /** No changes: the study is signed off, a card above is not current, or the person's role may not. */
  readOnly: boolean;
  onSave: (parameters: object) => void;
  saving: boolean;
  /** Field errors from the last save, keyed by path inside the parameters ("elements", …). */
  errors: Record<string, string>;
}

export const stepParameters = <T>(study: Study, key: Step['key']) =>
  (study.steps.find((s) => s.key === key)?.parameters ?? null) as T | null;
