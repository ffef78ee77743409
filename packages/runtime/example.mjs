// The runtime under plain Node, no other package: walk the example character over the example course for a few
// seconds at uneven frame times and print where its feet are.
//   node node_modules/treadle-runtime/example.mjs [profile.json character.glb course.json]
import { readFileSync } from 'node:fs';
import { loadLegProfile, bindLegProfile, createLegRuntime, skeletonFromGltf, courseGround, RUNTIME_VERSION } from 'treadle-runtime';

const here = (name) => new URL(`./sample/${name}`, import.meta.url);
const [profileFile, characterFile, courseFile] = process.argv.length >= 5 ? process.argv.slice(2, 5) : [here('wicket.leg-profile.json'), here('wicket.glb'), here('scrapyard.course.json')];

const profile = loadLegProfile(readFileSync(profileFile, 'utf8'));
const legs = createLegRuntime(bindLegProfile(profile, skeletonFromGltf(readFileSync(characterFile))), courseGround(readFileSync(courseFile, 'utf8')));
legs.drive(0, 1, 0); // 1 m/s along +Z, no turn

// Frame times as a game sees them: 1/144 s to 1/20 s, from a fixed sequence so every run prints the same.
let seed = 1;
const nextDt = () => 1 / 144 + ((seed = (seed * 16807) % 2147483647) / 2147483647) * (1 / 20 - 1 / 144);
const foot = new Float64Array(3);
const body = new Float64Array(3);
for (let t = 0; t < 4; ) {
  const dt = nextDt();
  legs.update(dt);
  t += dt;
}
legs.bodyPosition(body);
console.log(`treadle-runtime ${RUNTIME_VERSION}: ${profile.character.name} v${profile.version}, ${legs.frame} steps of ${(legs.timeStep * 1000).toFixed(2)} ms`);
console.log(`body  x ${body[0].toFixed(3)}  y ${body[1].toFixed(3)}  z ${body[2].toFixed(3)} m`);
legs.legNames.forEach((name, i) => {
  legs.footPosition(i, foot);
  console.log(`${name.padEnd(12)} ${legs.inStance(i) ? 'stance' : 'swing '}  x ${foot[0].toFixed(3)}  y ${foot[1].toFixed(3)}  z ${foot[2].toFixed(3)} m`);
});
if (legs.lastError || ![...body].every(Number.isFinite)) {
  console.error(`problem: ${legs.lastError?.message ?? 'the body position is not finite'}`);
  process.exit(1);
}
