// Benchmark of `import mbox` (run after `npx tsc`; reads dist/).
// Generates an invented mbox of the given size in the system's temporary folder (streamed; nothing
// is kept in memory), imports it in a child process and prints the time, the throughput and the
// child's peak resident memory. It runs a small file first, so the growth of peak memory from the
// small to the large file shows whether memory stays flat (it should grow by a few MB at most).
//
//   node scripts/bench-import.mjs            # 50 MB, then 1024 MB
//   node scripts/bench-import.mjs 20 200     # sizes in MB
import { spawnSync } from 'node:child_process';
import { createWriteStream, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const sizes = process.argv.slice(2).map(Number).filter((n) => n > 0);
const runs = sizes.length > 0 ? sizes : [50, 1024];
const root = fileURLToPath(new URL('..', import.meta.url));

const WORDS = 'calm glad tired busy hopeful worried proud sleepy grateful restless cheerful anxious content weary eager'.split(' ');
function sentence(i) {
  const out = [];
  for (let k = 0; k < 12; k++) out.push(WORDS[(i * 7 + k * 3) % WORDS.length]);
  return `${out.join(' ')}.`;
}

/** One invented message: every third from the participant; plain, quoted-printable, base64 and multipart bodies. */
function message(i) {
  const own = i % 3 === 0;
  const from = own ? 'Dana Vos <dana@example.org>' : `Friend ${i % 50} <friend${i % 50}@example.net>`;
  const day = 1 + (i % 28);
  const date = `Mon, ${day} Mar 2025 ${String(i % 24).padStart(2, '0')}:${String(i % 60).padStart(2, '0')}:00 +0100`;
  const text = Array.from({ length: 8 }, (_, k) => sentence(i + k)).join('\n');
  const quote = `\n\nOn ${date}, Friend wrote:\n> ${sentence(i + 1)}\n> From the other side\n\n-- \nDana`;
  let headers = `From: ${from}\nTo: someone@example.com\nSubject: note ${i}\nDate: ${date}\nMessage-ID: <${i}@example.org>\nMIME-Version: 1.0\n`;
  let body;
  switch (i % 4) {
    case 0:
      headers += 'Content-Type: text/plain; charset=utf-8\n';
      body = text + quote;
      break;
    case 1:
      headers += 'Content-Type: text/plain; charset=iso-8859-1\nContent-Transfer-Encoding: quoted-printable\n';
      body = `Caf=E9 ${text.replace(/\n/g, '=\n')}`;
      break;
    case 2:
      headers += 'Content-Type: text/plain; charset=utf-8\nContent-Transfer-Encoding: base64\n';
      body = Buffer.from(text + quote).toString('base64').replace(/(.{76})/g, '$1\n');
      break;
    default:
      headers += 'Content-Type: multipart/alternative; boundary="b1"\n';
      body = `--b1\nContent-Type: text/plain; charset=utf-8\n\n${text}\n--b1\nContent-Type: text/html; charset=utf-8\n\n<p>${text}</p>\n--b1--`;
  }
  return `From ${own ? 'dana@example.org' : 'friend@example.net'} Mon Mar  3 09:00:00 2025\n${headers}\n${body.replace(/^From /gm, '>From ')}\n\n`;
}

async function generate(path, megabytes) {
  const target = megabytes * 1024 * 1024;
  const out = createWriteStream(path);
  let written = 0;
  let i = 0;
  while (written < target) {
    const chunk = message(i++);
    written += Buffer.byteLength(chunk);
    if (!out.write(chunk)) await new Promise((resolve) => out.once('drain', resolve));
  }
  await new Promise((resolve) => out.end(resolve));
  return i;
}

const child = `
const { runImport } = await import(${JSON.stringify(join(root, 'dist/index.js'))});
const started = performance.now();
const result = await runImport({
  source: { format: 'mbox', path: process.argv[1], person: 'P01', zone: 'Europe/Amsterdam', addresses: ['dana@example.org'] },
  steps: {},
  out: process.argv[2],
  redactMessages: (t) => t,
});
const seconds = (performance.now() - started) / 1000;
console.log(JSON.stringify({ seconds, maxRssMB: process.resourceUsage().maxRSS / 1024, reconciliation: result.reconciliation }));
`;

const peaks = [];
for (const mb of runs) {
  const input = join(tmpdir(), `lexichron-bench-${process.pid}-${mb}.mbox`);
  const out = join(tmpdir(), `lexichron-bench-${process.pid}-${mb}.jsonl`);
  try {
    const messages = await generate(input, mb);
    const bytes = statSync(input).size;
    const run = spawnSync(process.execPath, ['--input-type=module', '-e', child, input, out], { encoding: 'utf8', maxBuffer: 1 << 24 });
    if (run.status !== 0) throw new Error(run.stderr);
    const r = JSON.parse(run.stdout.trim().split('\n').pop());
    peaks.push(r.maxRssMB);
    const mbps = bytes / 1024 / 1024 / r.seconds;
    console.log(
      `import mbox: ${(bytes / 1024 / 1024).toFixed(0)} MB, ${messages} messages (kept ${r.reconciliation.kept}, third-party ${r.reconciliation.dropped.third_party ?? 0}): ` +
        `${r.seconds.toFixed(1)} s, ${mbps.toFixed(1)} MB/s, ${(messages / r.seconds).toFixed(0)} messages/s, peak RSS ${r.maxRssMB.toFixed(0)} MB`,
    );
  } finally {
    if (!process.env.KEEP) for (const p of [input, out, `${out}.rejects.csv`, `${out}.meta.json`]) rmSync(p, { force: true });
  }
}
if (peaks.length > 1) console.log(`peak RSS growth from ${runs[0]} MB to ${runs[runs.length - 1]} MB: ${(peaks[peaks.length - 1] - peaks[0]).toFixed(0)} MB`);
