/**
 * View benchmark: `npm run bench:view`. Poses 1 and 4 demo characters' own skinned meshes from their trials
 * in headless chromium (the same bundle of components/viewer code the app runs) and reports the JavaScript time
 * per frame, GPU work excluded (nothing is drawn). Goal: under 2 ms per frame for four characters. Printed
 * beside peers measured in the same run: the scene's matrix update without posing, and the stick figure.
 */
import { build } from 'esbuild';
import path from 'node:path';
import { codeStairsCourse } from '../../engine/course';
import { rigFromCharacter } from '../../engine/gait/character-rig';
import { defaultLegSetup } from '../../engine/gait/leg-setup';
import { runTrial } from '../../engine/gait/trial';
import { encodeSeries } from '../../engine/gait/series-encoding';
import { TRIAL_SECONDS } from '../../schemas/trials';
import { importGltf } from '../../server/services/gltf-import';
import { mappingOf } from '../../engine/rig/leg-mapping';
import { buildCharacterGlb } from '../../seeds/characters/rig-builder';
import { DEMO_DESIGNS } from '../../seeds/characters';
import { launchBrowser } from '../support/browser';
import type { BenchInput, runBench } from './view-page';

const GOAL_MS = 2;
const READINGS = process.argv.includes('--quick') ? 20 : 60;

async function main() {
  const course = codeStairsCourse(5, 'up', { leadIn: 2.5, leadOut: 2.5, cellSize: 0.04 });
  const characters: BenchInput['characters'] = [];
  for (const design of DEMO_DESIGNS) {
    const glb = await buildCharacterGlb(design);
    const imported = await importGltf([{ originalname: `${design.name}.glb`, buffer: Buffer.from(glb) }]);
    const rig = rigFromCharacter(imported.skeleton, imported.detection.legs.map(mappingOf), { name: design.name });
    const series = encodeSeries(runTrial(rig, defaultLegSetup(rig), course, { duration: TRIAL_SECONDS }).series);
    characters.push({ name: design.name, glb: Buffer.from(glb).toString('base64'), rig, series });
  }
  const bundle = await build({
    entryPoints: [path.join(__dirname, 'view-page.ts')],
    bundle: true,
    write: false,
    format: 'iife',
    platform: 'browser',
    target: 'es2022',
    minify: true,
    logLevel: 'error',
    // The theme names its font files; the benchmark draws no text.
    loader: { '.ttf': 'empty' },
  });
  const { browser, close } = await launchBrowser();
  try {
    const page = await browser.newPage();
    const problems: string[] = [];
    page.on('pageerror', (e) => problems.push(e.message));
    await page.setContent('<!doctype html><html><body>bench:view</body></html>');
    await page.addScriptTag({ content: bundle.outputFiles[0].text });
    const out = await page.evaluate(
      (input) => (globalThis as unknown as { runBench: typeof runBench }).runBench(input),
      { characters, frames: READINGS } as BenchInput,
    );
    if (problems.length) throw new Error(problems.join('; '));
    const v = await browser.version();
    console.log(`bench:view — headless chromium ${v}, ${READINGS} readings of 100 frames each; characters: ${out.characters.join(', ')}`);
    console.log('JavaScript per frame (ms), median and 95th percentile:');
    for (const [name, r] of Object.entries(out.results)) console.log(`  ${name.padEnd(14)} ${r.median.toFixed(3).padStart(7)}  ${r.p95.toFixed(3).padStart(7)}`);
    for (const n of [1, 4]) {
      const pose = out.results[`pose ${n}`].median;
      console.log(
        `  ${n} character${n > 1 ? 's' : ''}: posing ${pose.toFixed(3)} ms = ${(pose / Math.max(out.results[`no posing ${n}`].median, 1e-4)).toFixed(2)}× the unposed matrix update, ${(pose / Math.max(out.results[`stick ${n}`].median, 1e-4)).toFixed(2)}× the stick figure`,
      );
    }
    const four = out.results['pose 4'].median;
    console.log(`goal: four characters under ${GOAL_MS} ms per frame — ${four < GOAL_MS ? 'met' : 'NOT met'} (${four.toFixed(3)} ms)`);
  } finally {
    await close();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
