/**
 * The per-file floor of `npm run mutate`: Stryker's own `thresholds.break` covers the overall score only. Reads
 * Stryker's JSON report (mutation-testing-report-schema), prints the score of every mutated file, the mutants marked
 * equivalent with a disable comment, and exits 1 when a file is below the floor or the whole is below its floor.
 *
 *   node --import tsx scripts/mutation-scores.ts [report.json] [--file-floor 75] [--overall-floor 85]
 */
import { readFileSync } from 'node:fs';

interface ReportMutant {
  mutatorName: string;
  status: string;
  statusReason?: string;
  location: { start: { line: number } };
}
interface Report {
  files: Record<string, { mutants: ReportMutant[] }>;
}

export interface FileScore {
  file: string;
  detected: number;
  undetected: number;
  ignored: number;
  /** Killed or timed out ÷ all that ran or had no test (compile and runtime errors and ignored ones excluded). */
  score: number | null;
}

const DETECTED = new Set(['Killed', 'Timeout']);
const UNDETECTED = new Set(['Survived', 'NoCoverage']);

export function fileScores(report: Report): FileScore[] {
  return Object.entries(report.files)
    .map(([file, { mutants }]) => {
      const detected = mutants.filter((m) => DETECTED.has(m.status)).length;
      const undetected = mutants.filter((m) => UNDETECTED.has(m.status)).length;
      const ignored = mutants.filter((m) => m.status === 'Ignored').length;
      const valid = detected + undetected;
      return { file, detected, undetected, ignored, score: valid === 0 ? null : (100 * detected) / valid };
    })
    .sort((a, b) => a.file.localeCompare(b.file));
}

/** Mutants switched off in the source with `// Stryker disable …: reason` (not the ones `ignoreStatic` skips). */
export function markedEquivalent(report: Report) {
  return Object.entries(report.files).flatMap(([file, { mutants }]) =>
    mutants
      .filter((m) => m.status === 'Ignored' && m.statusReason !== undefined && !/static/i.test(m.statusReason))
      .map((m) => ({ file, line: m.location.start.line, mutator: m.mutatorName, reason: m.statusReason ?? '' })),
  );
}

function option(args: string[], name: string, fallback: number): number {
  const at = args.indexOf(name);
  if (at < 0) return fallback;
  const value = Number(args[at + 1]);
  if (!Number.isFinite(value)) throw new Error(`${name} needs a number`);
  return value;
}

function main(args: string[]): number {
  const path = args.find((a, i) => !a.startsWith('--') && !args[i - 1]?.startsWith('--')) ?? 'reports/mutation/mutation.json';
  const fileFloor = option(args, '--file-floor', 75);
  const overallFloor = option(args, '--overall-floor', 85);
  const report = JSON.parse(readFileSync(path, 'utf8')) as Report;
  const scores = fileScores(report);
  const pct = (n: number | null) => (n === null ? '   n/a' : `${n.toFixed(1).padStart(5)} %`);
  const width = Math.max(...scores.map((s) => s.file.length), 4);
  console.log(`${'file'.padEnd(width)}   score  killed  survived  ignored`);
  for (const s of scores) {
    const mark = s.score !== null && s.score < fileFloor ? `  ← below ${fileFloor} %` : '';
    console.log(`${s.file.padEnd(width)} ${pct(s.score)} ${String(s.detected).padStart(7)} ${String(s.undetected).padStart(9)} ${String(s.ignored).padStart(8)}${mark}`);
  }
  const detected = scores.reduce((n, s) => n + s.detected, 0);
  const undetected = scores.reduce((n, s) => n + s.undetected, 0);
  const overall = detected + undetected === 0 ? null : (100 * detected) / (detected + undetected);
  console.log(`${'all'.padEnd(width)} ${pct(overall)} ${String(detected).padStart(7)} ${String(undetected).padStart(9)}`);
  const marked = markedEquivalent(report);
  console.log(`\n${marked.length} mutant(s) marked equivalent in the source:`);
  for (const m of marked) console.log(`  ${m.file}:${m.line} ${m.mutator}: ${m.reason}`);

  const low = scores.filter((s) => s.score !== null && s.score < fileFloor);
  if (low.length > 0) console.error(`\n${low.length} file(s) below the ${fileFloor} % floor: ${low.map((s) => s.file).join(', ')}`);
  if (overall !== null && overall < overallFloor) console.error(`\nThe overall score ${overall.toFixed(1)} % is below ${overallFloor} %.`);
  return low.length > 0 || (overall !== null && overall < overallFloor) ? 1 : 0;
}

if (import.meta.url === `file://${process.argv[1]}`) process.exit(main(process.argv.slice(2)));
