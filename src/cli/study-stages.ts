import type { StudyStage } from '../pipeline.js';
import { defaultStudyStages } from '../io/study-stages.js';
import { crossMapProgress } from './cross-map-progress.js';

/** The stages `lexichron run` calls after score and series, in order, with cross-mapping progress on stderr. */
export function studyStages(): Array<[string, StudyStage]> {
  return defaultStudyStages({ dynamics: { onProgress: crossMapProgress() } });
}
