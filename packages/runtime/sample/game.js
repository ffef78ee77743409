// The sample game: a character walked with the keys or an on-screen stick over a course, through
// treadle-runtime alone. three.js draws; the runtime plants the feet. Plain ES modules, no build step.
import * as THREE from 'three';
import { GLTFLoader } from 'three/addons/loaders/GLTFLoader.js';
import { loadLegProfile, bindLegProfile, createLegRuntime, skeletonFromBones, courseGround } from 'treadle-runtime';

/** Walking speed at full stick, m/s, and turn rate, rad/s: the game's choice; the runtime keeps within the profile's limits. */
const WALK_SPEED = 1.2;
const TURN_RATE = 1.5;

const page = document.body.dataset;
const query = new URLSearchParams(location.search);
const status = document.getElementById('status');
const say = (text) => (status.textContent = text);

async function fetchOk(url, as) {
  const res = await fetch(url, { credentials: 'same-origin' });
  if (!res.ok) throw new Error(`${url} answered ${res.status}${res.status === 401 ? ': sign in to Treadle first' : ''}`);
  return as === 'bytes' ? res.arrayBuffer() : res.text();
}

/** Where the three files come from: Treadle's API for a profile it serves, or files beside the page. */
async function sources() {
  if (page.profileId) {
    const detail = JSON.parse(await fetchOk(`/api/profiles/${page.profileId}`));
    const version = detail.profile.latest?.version;
    if (!version) throw new Error('this profile has no published version yet');
    let course = query.get('course');
    if (!course) {
      const list = JSON.parse(await fetchOk('/api/courses')).courses;
      if (!list.length) throw new Error('the studio has no course to walk on: make one under Courses');
      course = list[0].id;
    }
    return { profile: `/api/v1/profiles/${page.profileId}/versions/${version}`, character: `/api/characters/${detail.profile.character.id}/file`, course: `/api/courses/${course}` };
  }
  return { profile: query.get('profile') ?? 'wicket.leg-profile.json', character: query.get('character') ?? 'wicket.glb', course: query.get('course') ?? 'scrapyard.course.json' };
}

function groundMesh(g) {
  const geometry = new THREE.PlaneGeometry((g.cols - 1) * g.cellSize, (g.rows - 1) * g.cellSize, g.cols - 1, g.rows - 1);
  geometry.rotateX(-Math.PI / 2);
  const p = geometry.attributes.position;
  // PlaneGeometry runs its rows from −Z to +Z after the turn; row r of the ground lies at z = r·cellSize.
  for (let r = 0; r < g.rows; r++) {
    for (let c = 0; c < g.cols; c++) {
      const i = r * g.cols + c;
      p.setXYZ(i, (c - (g.cols - 1) / 2) * g.cellSize, g.heights[i], r * g.cellSize);
    }
  }
  geometry.computeVertexNormals();
  return new THREE.Mesh(geometry, new THREE.MeshLambertMaterial({ color: '#cfc6b3' }));
}

function skinOf(scene) {
  let best = null;
  scene.traverse((o) => {
    if (o.isSkinnedMesh && (!best || o.skeleton.bones.length > best.skeleton.bones.length)) best = o;
  });
  if (!best) throw new Error('the character has no skinned mesh');
  return best;
}

/** Keys (WASD or arrows) and the on-screen stick both set the same two numbers. */
function controls() {
  const keys = new Set();
  const stick = { x: 0, y: 0 };
  addEventListener('keydown', (e) => keys.add(e.key.toLowerCase()));
  addEventListener('keyup', (e) => keys.delete(e.key.toLowerCase()));
  addEventListener('blur', () => keys.clear());
  const pad = document.getElementById('stick');
  const knob = pad.firstElementChild;
  let held = null;
  const move = (e) => {
    const box = pad.getBoundingClientRect();
    const r = box.width / 2;
    let x = (e.clientX - box.left - r) / r;
    let y = (e.clientY - box.top - r) / r;
    const n = Math.hypot(x, y);
    if (n > 1) (x /= n), (y /= n);
    stick.x = x;
    stick.y = -y;
    knob.style.transform = `translate(${x * r * 0.6}px, ${y * r * 0.6}px)`;
  };
  pad.addEventListener('pointerdown', (e) => {
    held = e.pointerId;
    pad.setPointerCapture(e.pointerId);
    move(e);
  });
  pad.addEventListener('pointermove', (e) => e.pointerId === held && move(e));
  const release = (e) => {
    if (e.pointerId !== held) return;
    held = null;
    stick.x = stick.y = 0;
    knob.style.transform = '';
  };
  pad.addEventListener('pointerup', release);
  pad.addEventListener('pointercancel', release);
  const key = (...names) => names.some((k) => keys.has(k));
  return () => ({
    forward: Math.max(stick.y, key('w', 'arrowup') ? 1 : 0),
    turn: stick.x + (key('a', 'arrowleft') ? 1 : 0) - (key('d', 'arrowright') ? 1 : 0),
  });
}

async function start() {
  const from = await sources();
  say('Loading the profile, the character and the course…');
  const [profileText, characterBytes, courseText] = await Promise.all([fetchOk(from.profile), fetchOk(from.character, 'bytes'), fetchOk(from.course)]);
  const profile = loadLegProfile(profileText);
  const ground = courseGround(courseText);
  const gltf = await new GLTFLoader().parseAsync(characterBytes, '');
  const skinned = skinOf(gltf.scene);
  const bones = skinned.skeleton.bones;
  gltf.scene.updateMatrixWorld(true);
  const legs = createLegRuntime(bindLegProfile(profile, skeletonFromBones(bones)), ground, { standing: true }); // spawn at rest

  // Rest rotations in the character's own space, once: a moving bone turns by the runtime's rotation from there.
  const sceneInverse = gltf.scene.matrixWorld.clone().invert();
  const restOf = new Map();
  const restQ = (o) => {
    if (!restOf.has(o)) {
      const q = new THREE.Quaternion();
      new THREE.Matrix4().multiplyMatrices(sceneInverse, o.matrixWorld).decompose(new THREE.Vector3(), q, new THREE.Vector3());
      restOf.set(o, q);
    }
    return restOf.get(o);
  };
  const moving = legs.legNames.map((_, i) => legs.jointIndices(i).map((j) => ({ bone: bones[j], rest: restQ(bones[j]), parentRest: restQ(bones[j].parent), posed: new THREE.Quaternion() })));

  const renderer = new THREE.WebGLRenderer({ canvas: document.getElementById('view'), antialias: true, preserveDrawingBuffer: true });
  renderer.setPixelRatio(Math.min(devicePixelRatio, 2));
  const scene = new THREE.Scene();
  scene.background = new THREE.Color('#f5f1e8');
  scene.add(new THREE.HemisphereLight('#f5f1e8', '#5a6670', 2.2));
  const sun = new THREE.DirectionalLight('#ffffff', 1.5);
  sun.position.set(3, 6, 2);
  scene.add(sun, groundMesh(ground));
  const carrier = new THREE.Group();
  carrier.matrixAutoUpdate = false;
  carrier.add(gltf.scene);
  gltf.scene.traverse((o) => (o.frustumCulled = false));
  scene.add(carrier);
  const camera = new THREE.PerspectiveCamera(45, 1, 0.05, 200);
  // The character's height at rest: the camera keeps a size's distance whatever the character's scale.
  const size = Math.max(0.2, new THREE.Box3().setFromObject(gltf.scene).getSize(new THREE.Vector3()).y);
  const resize = () => {
    renderer.setSize(innerWidth, innerHeight, false);
    camera.aspect = innerWidth / innerHeight;
    camera.updateProjectionMatrix();
  };
  addEventListener('resize', resize);
  resize();

  const read = controls();
  const m = new Float64Array(16);
  const body = new Float64Array(3);
  const rot = new Float64Array(4);
  const b = new THREE.Quaternion();
  const bInverse = new THREE.Quaternion();
  const w = new THREE.Quaternion();
  const mw = new THREE.Matrix4();
  const shown = document.getElementById('stumbles');
  let heading = 0;
  let last = performance.now();

  function frame(now) {
    const dt = Math.min(0.1, (now - last) / 1000);
    last = now;
    const input = read();
    // The game owns the heading and the speed it asks for; the runtime follows within the profile's limits.
    heading += input.turn * TURN_RATE * dt;
    const v = input.forward * WALK_SPEED;
    legs.drive(Math.sin(heading) * v, Math.cos(heading) * v, input.turn * TURN_RATE);
    legs.update(dt);

    carrier.matrix.fromArray(legs.characterMatrix(m));
    carrier.matrixWorldNeedsUpdate = true;
    legs.bodyRotation(rot);
    b.set(rot[0], rot[1], rot[2], rot[3]);
    bInverse.copy(b).invert();
    moving.forEach((chain, i) => {
      chain.forEach((jt, k) => {
        // The runtime's joint rotation is in rest-space axes: relative to the body, it turns the rest pose.
        w.setFromRotationMatrix(mw.fromArray(legs.jointWorldMatrix(i, k, m)));
        jt.posed.copy(bInverse).multiply(w).multiply(jt.rest);
        const parent = k > 0 && chain[k - 1].bone === jt.bone.parent ? chain[k - 1].posed : jt.parentRest;
        jt.bone.quaternion.copy(parent).invert().multiply(jt.posed);
      });
    });

    legs.bodyPosition(body);
    // Behind and beside the body, farther on a tall narrow screen so the whole character and the ground ahead show.
    const far = size * (camera.aspect < 1 ? 2.6 : 1.6);
    camera.position.set(body[0] + 1.1 * far, body[1] + 0.5 * far, body[2] - 1.0 * far);
    camera.lookAt(body[0], body[1] - 0.3 * size, body[2] + 0.4 * size);
    renderer.render(scene, camera);

    shown.textContent = `speed ${legs.speed.toFixed(2)} m/s · cycle ${legs.cycleTime.toFixed(2)} s${legs.resting ? ' · resting' : ''}`;
    document.body.dataset.bodyZ = body[2].toFixed(4);
    say(legs.lastError?.message ?? `${profile.character.name} v${profile.version} · x ${body[0].toFixed(2)} z ${body[2].toFixed(2)} m`);
    requestAnimationFrame(frame);
  }
  requestAnimationFrame(frame);
}

start().catch((err) => {
  document.body.dataset.failed = 'true';
  say(`Could not start: ${err.message}`);
});
