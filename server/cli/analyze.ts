// `npm run analyze -- <file> [--json]`: the tempo engine on one file, for people and scripts.
// Exit codes: 0 analysed, 2 not an audio file (or bad usage), 1 anything unexpected.
import fs from 'node:fs';
import { analyse } from '@/audio/analysis/analyse';
import { decodeFile, NotAudioError } from '@/server/analysis/decode';
import type { Analysis } from '@/shared/analysis';

async function main(argv: string[]) {
  const json = argv.includes('--json');
  const file = argv.find((a) => !a.startsWith('--'));
  if (!file) {
    console.error('usage: npm run analyze -- <audio file> [--json]');
    return 2;
  }
  if (!fs.existsSync(file) || !fs.statSync(file).isFile()) {
    console.error(`tactus analyze: no such file: ${file}`);
    return 2;
  }
  const started = performance.now();
  let result: Analysis;
  try {
    const { samples, sampleRate } = await decodeFile(file);
    result = await analyse(samples, sampleRate);
  } catch (err) {
    if (err instanceof NotAudioError) {
      console.error(`tactus analyze: ${file}: ${err.message}`);
      return 2;
    }
    throw err;
  }
  // analysisMs covers decoding too: the whole job from file to answer.
  result = { ...result, analysisMs: Math.round(performance.now() - started) };
  if (json) {
    console.log(JSON.stringify(result));
  } else {
    console.log(humanReport(file, result));
  }
  return 0;
}

function humanReport(file: string, a: Analysis): string {
  if (a.bpm === null)
    return `${file}: no steady beat found (${a.durationSec.toFixed(1)} s analysed in ${a.analysisMs} ms)`;
  const others = a.candidates
    .slice(1)
    .map((c) => `${c.bpm} (${c.relation})`)
    .join(', ');
  return [
    `${file}`,
    `  tempo      ${a.bpm} BPM (confidence ${(a.confidence * 100).toFixed(0)} %)`,
    `  also       ${others || '—'}`,
    `  meter      ${a.meter ?? '—'}, ${a.beatCount} beats, ${a.downbeats.length} bars`,
    `  start/end  ${a.startBpm} → ${a.endBpm} BPM (drift ${a.driftPct} %, stability CV ${a.stabilityCv})`,
    `  length     ${a.durationSec.toFixed(1)} s, analysed in ${a.analysisMs} ms`,
  ].join('\n');
}

main(process.argv.slice(2)).then(
  (code) => process.exit(code),
  (err) => {
    console.error(`tactus analyze: ${(err as Error).message}`);
    process.exit(1);
  },
);
