import { join, relative } from 'node:path';
import type { StageOutput, StudyStage } from '../pipeline.js';
import { fileDigest } from './run-score.js';
import { runDynamics, type RatingsByBin, type RunDynamicsOptions } from './run-dynamics.js';
import { runValidate } from './run-validate.js';
import type { FileRecord } from '../report/manifest.js';
import type { TableResource } from '../report/data-dictionary.js';
import { windowMinutes } from '../validate/window-minutes.js';

/** File records (with SHA-256) of files written under `dir`, relative to the output folder. */
async function records(outDir: string, dir: string, files: readonly string[]): Promise<FileRecord[]> {
  const out: FileRecord[] = [];
  for (const file of files) {
    const path = join(dir, file);
    const d = await fileDigest(path);
    out.push({ path: relative(outDir, path), sha256: d.sha256, bytes: d.bytes });
  }
  return out;
}

/** Resources re-rooted at the output folder (their paths gain the stage's subfolder). */
function rerooted(resources: readonly TableResource[], folder: string): TableResource[] {
  return resources.map((r) => ({ ...r, path: `${folder}/${r.path}` }));
}

/**
 * Validation stage of `run`: the study's `ratings` against the series (bins, or windows before
 * each self-report), into `validation/`. Self-report ids are mapped like the text's (pseudonyms).
 * Also leaves the self-reports aggregated per bin in `context.shared.ratingsByBin` for dynamics.
 */
export const validateStage: StudyStage = async (context) => {
  const { study, outDir } = context;
  const settings = study.ratings;
  if (!settings) return undefined;
  const dir = join(outDir, 'validation');
  const run = await runValidate({
    series: context.series.longPath,
    events: context.series.eventsPath,
    ratings: context.at(settings.path),
    columns: settings.columns ? { person: settings.columns.person ?? 'person', time: settings.columns.time ?? 'time', text: 'text', id: settings.columns.id, zone: settings.columns.zone } : undefined,
    format: settings.format,
    delimiter: settings.delimiter,
    zones: context.zones,
    time: context.ratingsTime ?? context.time,
    ratingColumns: settings.ratings,
    missing: settings.missing,
    scales: new Map(Object.entries(settings.scales).map(([k, [min, max]]) => [k, { min, max }])),
    scoreColumns: settings.scores,
    out: dir,
    person: context.person,
    ...(context.pseudonymized ? { ratingsName: 'ratings' } : {}),
    validate: {
      align: settings.align,
      windowMinutes: windowMinutes(settings.window, '$.ratings.window'),
      minWords: settings.minWords,
      seed: context.seed,
      replicates: settings.replicates,
      minPairs: settings.minPairs,
      reliability: settings.reliability,
      randomSlopes: settings.randomSlopes,
    },
  });
  if (settings.align === 'bins') {
    const byBin = new Map<string, Record<string, number | undefined>>();
    for (const row of run.result.rows) byBin.set(`${row.person}\u0000${row.label}`, row.ratings);
    const ratings: RatingsByBin = { columns: run.ratingColumns, byBin };
    context.shared.ratingsByBin = ratings;
  }
  const files = Object.values(run.files).filter((p): p is string => typeof p === 'string').map((p) => relative(dir, p));
  const output: StageOutput = {
    resources: rerooted(run.resources, 'validation'),
    outputs: await records(outDir, dir, files),
    summary: {
      reconciliation: run.reconciliation,
      counts: run.result.counts,
      pairs: run.result.pairs.map(({ score, rating, analysis }) => ({ score, rating, verdict: analysis.verdict.text, warnings: analysis.verdict.warnings.map((w) => w.code) })),
    },
  };
  return output;
};

/** Dynamics stage of `run`: every score column (and the self-reports per bin, when validated by bins), into `dynamics/`. */
export const dynamicsStage: StudyStage = (context) => dynamicsStageWith({})(context);

/** The dynamics stage with threads and progress reporting for cross mapping (see runDynamics). */
export function dynamicsStageWith(threading: RunDynamicsOptions): StudyStage {
  return async (context) => {
    const settings = context.study.dynamics;
    if (settings === false) return undefined;
    const dir = join(context.outDir, 'dynamics');
    const ratings = settings.includeRatings ? (context.shared.ratingsByBin as RatingsByBin | undefined) : undefined;
    const run = await runDynamics(
      context.series.longPath,
      dir,
      {
        ...(settings.variables ? { variables: settings.variables } : {}),
        ...(settings.pairs ? { pairs: settings.pairs.map((p) => p.split(':') as [string, string]) } : {}),
        minLagPairs: settings.minPairs,
        ccm: {
          ...(settings.embedding !== undefined ? { E: settings.embedding } : {}),
          maxE: settings.maxEmbedding,
          tau: settings.tau,
          ...(settings.exclusionRadius !== undefined ? { exclusionRadius: settings.exclusionRadius } : {}),
          librarySizeCount: settings.librarySizes,
          samples: settings.libraries,
          surrogates: settings.surrogates,
          lagScan: settings.lagScan,
        },
        season: settings.season,
        skipCrossMapping: !settings.crossMapping,
        stack: settings.stack,
        seed: context.seed,
      },
      ratings,
      threading,
    );
    return {
      resources: rerooted(run.resources, 'dynamics'),
      outputs: await records(context.outDir, dir, run.files),
      summary: {
        persons: run.persons,
        variables: run.variables,
        ready: run.result.summaries.filter((s) => s.ready).length,
        series: run.result.summaries.length,
        crossMapping: run.result.ccm.length,
        converging: run.result.ccm.filter((c) => c.converges).length,
        drives: run.result.ccm.filter((c) => c.verdict === 'drives').length,
        diagnostics: run.diagnostics.length,
      },
    };
  };
}

/** The stages `lexichron run` calls after score and series, in order (`dynamics`: threads and progress of cross mapping). */
export function defaultStudyStages(options: { dynamics?: RunDynamicsOptions } = {}): Array<[string, StudyStage]> {
  return [
    ['validation', validateStage],
    ['dynamics', dynamicsStageWith(options.dynamics ?? {})],
  ];
}
