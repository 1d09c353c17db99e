import type { Command } from 'commander';
import { dirname, join } from 'node:path';
import { runSeries } from '../io/run-series.js';
import { readWindowsFile } from '../io/read-windows-file.js';
import { readZoneFile } from '../io/read-zone-file.js';
import { zoneOnDay } from '../series/zone-on-day.js';
import { SHARD_HELP, shardFrom } from './shard-option.js';
import { parseReducers, seriesOptionsFrom } from '../series/series-options.js';
import { addSeriesOptions } from './series-options.js';

/** `lexichron series SCORES... --bin DURATION --out FILE` */
export function registerSeries(program: Command): void {
  const command = program
    .command('series')
    .description('bin per-entry scores into regular per-person series in local time, with gaps explicit')
    .argument('<scores...>', 'scores CSV(s) written by `lexichron score`, each with its .meta.json beside it; several files (same lexicons) are binned into one series')
    .requiredOption('-o, --out <file>', 'long series CSV (wide, event-level and rejects files and datapackage.json go beside it)')
    .option('--shard <spec>', SHARD_HELP)
    .option('--parquet', 'also write the long series as Parquet (series-long.parquet beside the CSV: bin starts and ends as wall-clock times and as UTC instants)');
  addSeriesOptions(command);
  command.action(async (scores: string[], opts: Record<string, unknown>) => {
    const reducers = parseReducers(opts.aggregate as string | undefined);
    const shard = shardFrom(opts.shard);
    const zones = opts.zones ? await readZoneFile(String(opts.zones)) : undefined;
    const result = await runSeries({
      ...seriesOptionsFrom(opts),
      ...(opts.windows ? { windows: await readWindowsFile(String(opts.windows)) } : {}),
      ...(zones ? { zoneOn: zoneOnDay(zones) } : {}),
      scores,
      out: String(opts.out),
      ...(shard ? { shard } : {}),
      reducers: typeof reducers === 'string' ? undefined : reducers,
      allReducer: typeof reducers === 'string' ? reducers : undefined,
      dataPackage: { path: join(dirname(String(opts.out)), 'datapackage.json'), name: 'lexichron-series', title: 'lexichron series' },
    });
    for (const warning of result.warnings) process.stderr.write(`warning: ${warning}\n`);
    if (opts.parquet) process.stderr.write(`parquet: ${await (await import('../io/write-parquet.js')).writeParquet(result.longPath, 'series')}\n`);
    const missing = Object.entries(result.missing).map(([k, v]) => `${k} ${v}`).join(', ') || 'none';
    const rejected = Object.entries(result.rejected);
    if (rejected.length > 0) process.stderr.write(`${rejected.reduce((a, [, n]) => a + n, 0)} scores rows not used (${rejected.map(([k, n]) => `${k} ${n}`).join(', ')}): see ${result.rejectsPath}\n`);
    if (result.sources.length > 1) for (const s of result.sources) process.stderr.write(`${s.path}: ${s.rows} rows read, ${s.entries} binned, ${Object.values(s.rejected).reduce((a, n) => a + n, 0)} rejected${s.otherShard !== undefined ? `, ${s.otherShard} of other shards` : ''}\n`);
    if (result.otherShard !== undefined) process.stderr.write(`${result.otherShard} scores rows belong to other shards\n`);
    process.stderr.write(`${result.persons} persons, ${result.bins} bins (${result.observed} observed; missing: ${missing}); ${result.entries} entries, ${result.excludedEntries} in excluded hours\nlong:   ${result.longPath}\nwide:   ${result.widePath}\nevents: ${result.eventsPath}\n`);
  });
}
