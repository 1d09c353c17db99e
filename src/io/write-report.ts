import { join } from 'node:path';
import type { ReportOptions } from '../report/data/build-report-data.js';
import { renderReport } from '../report/html/render-report.js';
import { writeFileAtomic } from './atomic-write.js';
import { readReportData } from './read-report-data.js';

/** What {@link writeReport} wrote. */
export interface WriteReportResult {
  path: string;
  bytes: number;
  /** Sections without input, with the reason shown on the page. */
  absent: { section: string; reason: string }[];
}

/**
 * Builds the self-contained HTML report of a study output folder and writes it atomically to
 * `<outDir>/report.html` (or `options.file`). Call it after manifest.json is written so the
 * provenance section shows the final manifest. `source` is the folder name the page shows (default:
 * the name of `outDir`; `run` passes the output folder's name while it writes into a staging folder).
 */
export async function writeReport(outDir: string, options: ReportOptions & { file?: string; source?: string } = {}): Promise<WriteReportResult> {
  const data = await readReportData(outDir, options, options.source);
  const html = renderReport(data);
  const path = options.file ?? join(outDir, 'report.html');
  await writeFileAtomic(path, html);
  const absent: WriteReportResult['absent'] = [];
  for (const [section, part] of Object.entries(data)) if (typeof part === 'object' && part !== null && 'ok' in part && part.ok === false) absent.push({ section, reason: (part as { reason: string }).reason });
  return { path, bytes: Buffer.byteLength(html), absent };
}
