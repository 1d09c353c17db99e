import type { StudyStage } from '../pipeline.js';
import { defaultStudyStages } from '../io/study-stages.js';

/** The stages `lexichron run` calls after score and series, in order. */
export function studyStages(): Array<[string, StudyStage]> {
  return defaultStudyStages();
}
