import { Option, type Command } from 'commander';

/** Adds the options of the series stage. */
export function addSeriesOptions(command: Command): Command {
  return command
    .option('--bin <duration>', 'bin length: 30m, 1h, 3h, 1d, 1w …', '1d')
    .option('--day-start <HH:MM>', 'local clock time at which a day starts (04:00 puts a 01:30 entry into the previous day)', '00:00')
    .option('--min-words <n>', 'bins with fewer words are missing (too_few_words)', '1')
    .option('--exclude-hours <HH:MM-HH:MM>', 'local hours whose entries and bins are excluded, e.g. 00:00-07:00')
    .addOption(new Option('--fill <method>', 'fill short gaps (flagged in <score>.filled)').choices(['none', 'carry', 'linear']).default('none'))
    .option('--max-fill <bins>', 'longest run of missing bins that may be filled', '1')
    .option('--detrend', 'add <score>.detrended: residuals from each person\'s linear trend (raw columns kept)')
    .option('--aggregate <spec>', 'per-column bin reducer: weighted (word-weighted mean), mean (entry mean) or sum, as COL=REDUCER[,…] or one reducer for all')
    .option('--windows <file>', 'per-person study windows: CSV with person, from, to (local dates); bins outside are marked outside_window')
    .option('--zones <file>', 'the zone table used when scoring (person, zone[, from]): days are laid out in the zone in force, also on days without entries')
    .option('--from <date>', 'first local date of a common grid for everyone (YYYY-MM-DD)')
    .option('--to <date>', 'last local date of the common grid (YYYY-MM-DD)')
    .option('--max-bins <n>', 'most bins one person\'s series may have; more stops with the person and the entries at the ends of their series (a stray timestamp)', '100000')
    .option('--warn-span-days <n>', 'warn when a person\'s entries span more days than this', '730');
}
