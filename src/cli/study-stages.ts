import type { StudyStage } from '../pipeline.js';

/** The stages `lexichron run` calls after score and series, in order. */
export function studyStages(): Array<[string, StudyStage]> {
  return [];
}
