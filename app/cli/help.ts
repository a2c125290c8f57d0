// Help texts for `eggline --help` and `eggline <command> --help`. The analysis settings' lines come from the settings
// table (core/settings SETTINGS), so every setting's flag is listed with its help line and default.
import { DEFAULT_TIMEOUT_PER_FILE_S } from '../batch/run-batch';
import { DEFAULT_SETTINGS, runSettingSpec, SETTINGS, settingValue, type SettingSpec } from '../../core/settings';

/** The default of a setting as a flag would write it; '' when there is none. */
function defaultText(spec: SettingSpec): string {
  const v = settingValue(DEFAULT_SETTINGS, spec.key);
  if (v === null || (Array.isArray(v) && v.length === 0)) return '';
  return Array.isArray(v) ? v.join(',') : String(v);
}

/** One help line per settings flag: flag and value, help, [default]. */
export function settingsHelp(): string {
  return SETTINGS.filter((s) => s.key !== 'sliceIndex').map((s) => {
    const d = defaultText(s);
    const head = `${`  ${s.flag} ${s.flagValue}`.padEnd(29)} `;
    return d === '' ? `${head}${s.help}` : `${head}${s.help}  [${d}]`;
  }).join('\n');
}

/** Width of a help line, characters. */
const HELP_WIDTH = 100;

/** A run setting's help (RUN_SETTINGS): flag and value, its help line wrapped under the text column, [default]. */
export function runSettingHelp(key: string, defaultText: string): string {
  const spec = runSettingSpec(key);
  const indent = ' '.repeat(30);
  const words = `${spec.help}  [${defaultText}]`.split(' ');
  const lines: string[] = [];
  let line = `${`  ${spec.flag} ${spec.flagValue}`.padEnd(29)} `;
  let empty = true;
  for (const w of words) {
    if (!empty && line.length + 1 + w.length > HELP_WIDTH) { lines.push(line); line = indent; empty = true; }
    line += (empty ? '' : ' ') + w;
    empty = false;
  }
  lines.push(line);
  return lines.join('\n');
}

/** Top-level help. */
export const MAIN_HELP = `eggline — measure morphogen gradients along the AP axis of embryo images

Usage:
  eggline batch <folder> --out <dir> [options]   analyse every stack in a folder, write tables
  eggline merge <dir> [--samples <csv>]          combine the parts of a split batch (--shard, --slurm)
  eggline cohort <results-dir> --samples <csv>   compare conditions of a finished batch
  eggline inspect <file>                         show what a TIFF / OME-TIFF file or OME-Zarr folder holds
  eggline demo <dir>                             write a synthetic demo data set to try things on
  eggline --version                              print the version

Run "eggline <command> --help" for the options of a command.
`;

/** Help for the batch command. */
export const BATCH_HELP = `Usage: eggline batch <folder> --out <dir> [options]

Analyses every .tif/.tiff/.ome.tif(f)/.btf/.tf8/.tf2 file and every .zarr/.ome.zarr folder (OME-Zarr, read
as one stack) in <folder> and its subfolders (sorted by path; hidden files skipped) and writes embryos.csv,
boundaries.csv, profiles.csv, landmarks.csv, results.json and run.json to <dir>. Nothing is ever written
into <folder>; <dir> must not be <folder> or inside it.

Options:
  --out DIR                   output folder (created if missing)                       [required]
${runSettingHelp('jobs', 'default: number of cores')}
${settingsHelp()}
  --config FILE               settings JSON (keys as in results.json settings); flags win over it
  --project FILE              hand edits (axis, landmarks, fit range per file) and the cohort
                              options saved in the window (reference, background condition,
                              normalisation, equivalence margin, opposing gradient's λ); the
                              flags below override them
                              [default: <folder>/eggline-project.json when present]
  --no-project                ignore <folder>/eggline-project.json
  --samples CSV               sample sheet (file,condition[,dosage]); runs the cohort step after
  --reference COND            reference condition for the cohort step (needs --samples)
  --background-condition COND the sheet's condition of null or secondary-only stainings, subtracted
                              from every other embryo's profile before λ and boundaries are fitted
                              again in the cohort step (needs --samples; see eggline cohort --help);
                              "none" subtracts nothing even when the sheet's role column marks one
  --normalise MODE, --lambda-posterior-el V, --equivalence-margin M, --covariate COLUMN
                              the cohort step's profile normalisation, opposing gradient's decay
                              length, equivalence margin and covariates (repeatable), as in
                              eggline cohort (need --samples)
${runSettingHelp('fileTimeoutS', String(DEFAULT_TIMEOUT_PER_FILE_S))}
${runSettingHelp('maxMemoryBytes', '3/4 of memory / jobs, 1G to 8G')}
  --resume                    reuse the results journal.jsonl in <dir> holds for files whose bytes
                              (SHA-256) and settings are unchanged; analyse the rest
  -h, --help                  show this help

Movies (files with more than one time point) are also analysed over time, after the batch:
  --time all|K|A:B            time points to analyse (0-based; A:B includes both ends)       [all]
  --axis-per-time             find the axis at every time point (embryos that drift)
                              [default: once per movie, on the mean over up to 8 time points]
  --time-step S               seconds between time points when the file does not say; plain
                              multi-page files are then read as one plane per time point
  --tau-range A,B             x/EL range of the accumulation-time model fit             [0.1,0.4]
  --baseline-frames N         frames before production starts (their mean is the zero)       [1]
  They write timecourse.csv, timecourse_profiles.csv, timecourse_boundaries.csv, timecourse_landmarks.csv,
  accumulation.csv, model_fit.csv, timelapse/*.svg and timelapse.html. A movie's rows in profiles.csv, boundaries.csv and
  results.json are then those of every analysed time point (columns t_index, t_s); its embryos.csv row,
  which the cohort step uses, is its last analysed time point. Each part of a split batch does this for
  its own movies.

While it runs, every finished file is appended to <dir>/journal.jsonl; the tables are written at the end.
Ctrl+C or SIGTERM stops cleanly (tables of the finished files, run.json with "complete": false); a second
Ctrl+C quits at once. Either way, --resume finishes the run.

Splitting a batch (a cluster, or several machines sharing a file system):
  --shard K/N                 analyse only part K of N (files split by size, the same on every machine);
                              writes to <dir>/parts/K-of-N; combine the parts with "eggline merge <dir>"
  --slurm N                   analyse nothing: write <dir>/eggline-array.sbatch (N tasks, one part each)
                              and <dir>/eggline-merge.sbatch, and print the two commands that submit them
  --slurm-options "…"         sbatch options for both scripts (partition, account, time limit, …),
                              e.g. "--partition=long --time=04:00:00"; --cpus-per-task or --mem here
                              replace the ones Eggline sets
  With --slurm, --jobs sets the cores per task [2]; --samples, --reference and
  --background-condition go to the merge job.

Exit status: 0 all files analysed, 1 some files failed or the run stopped early, 2 usage error.
`;

/** Help for the merge command. */
export const MERGE_HELP = `Usage: eggline merge <dir> [options]

Combines the parts of a split batch (<dir>/parts/K-of-N, written by "eggline batch … --out <dir> --shard K/N")
into <dir>: embryos.csv, boundaries.csv, profiles.csv, landmarks.csv and results.json with the rows in the
order of a one-machine run, and a run.json listing every input. Refuses (exit 2) a missing or unfinished part,
a part present twice, and parts made with different settings, hand edits, Eggline versions or input lists.

Options:
  --samples CSV               sample sheet (file,condition[,dosage]); runs the cohort step after the merge
  --reference COND            reference condition for the cohort step (needs --samples)
  --background-condition COND the sheet's condition of null or secondary-only stainings, subtracted
                              from every other embryo's profile before λ and boundaries are fitted
                              again in the cohort step (needs --samples; see eggline cohort --help);
                              "none" subtracts nothing even when the sheet's role column marks one
  --normalise MODE, --lambda-posterior-el V, --equivalence-margin M, --covariate COLUMN
                              the cohort step's other options, as in eggline cohort (need --samples;
                              --covariate is repeatable)
  --project FILE              take the options above from the project file's cohort entry; a flag
                              given here overrides the project's value (needs --samples)
  --allow-missing             merge the parts that are there; run.json lists the files without a row
  -h, --help                  show this help

Exit status: 0 merged, every file analysed; 1 merged, but some files failed or are missing, or the cohort
step failed; 2 usage error or merge refused.
`;

/** Help for the inspect command. */
export const INSPECT_HELP = `Usage: eggline inspect <file> [--json]

Prints what the file's tags say: format, dimensions, channels, pixel size and where it came from,
sample type, compression and which IFD holds each plane. Pixels are not decoded.
For an OME-Zarr folder: the NGFF and Zarr versions, axes with their units, channels, pixel size, z and
time steps, sample type, chunk shape and codecs of the full-resolution array.
  --json    the same facts as one JSON object (keys listed in the README)
`;

/** Help for the demo command. */
export const DEMO_HELP = `Usage: eggline demo <dir> [--count N]

Writes a synthetic demo data set (invented embryos, OME-TIFF with deflate) to <dir>, with samples.csv
(file,condition,dosage), eggline-project.json (a hand-marked landmark per file) and README.txt.
  --count N    write only the first N embryos of the set
`;
