/**
 * The glTF import's work on untrusted bytes: from uploaded files to a skeleton with detected legs and a report,
 * or a refusal that names the problem. It runs on the import worker thread (server/workers/gltf-import-worker.ts);
 * everything else calls importGltf in gltf-import.ts. Nothing here touches the database or the disk.
 */
import type { Document } from '@gltf-transform/core';
import type { ImportNote, ImportReport, ValidatorFindingGroup } from '../../schemas/characters';
import type { Skeleton } from '../../engine/rig/types';
import { detectLegs, type LegDetection } from '../../engine/rig/detect-legs';
import { jointWorldPositions } from '../../engine/rig/skeleton-world';
import { formatLength, guessUnit, skeletonHeight, unitScaleWarning, type LengthUnit, type UnitGuess } from '../../engine/rig/skeleton-scale';
import { rigQuirks } from '../../engine/rig/rig-quirks';
import { rootConversionOf } from '../../engine/rig/root-conversion';
import { groupFindings, skeletonErrors } from './gltf-import-findings';
import { readContainer, type Container, type UploadedFile } from './gltf-import-container';
import { DEFAULT_JSON_BOUNDS } from './gltf-import-json-scan';
import { checkStructure } from './gltf-import-structure';
import { validateContainer } from './gltf-import-validator';
import { importSkeleton, type ImportedSkeleton } from './gltf-import-skeleton';
import { refuse } from './gltf-import-refusals';
import { memoryNodeIO, supportedExtensions } from './gltf-import-library';


/** Legs below this confidence get a note asking the person to check them. */
const CHECK_CONFIDENCE = 0.6;

export interface ImportedCharacter {
  format: 'glb' | 'gltf';
  fileName: string;
  /** The bytes to store: the uploaded .glb as it came, or a .gltf with its parts packed into one .glb. */
  glb: Uint8Array;
  skeleton: Skeleton;
  inverseBindMatrices: Float64Array;
  positions: Float64Array;
  detection: LegDetection;
  report: ImportReport;
}

async function readDocument(c: Container): Promise<Document> {
  const io = memoryNodeIO();
  try {
    if (c.format === 'glb') return await io.readBinary(new Uint8Array(c.main.buffer.buffer, c.main.buffer.byteOffset, c.main.buffer.byteLength));
    return await io.readJSON({ json: c.json as never, resources: c.resources as Record<string, Uint8Array<ArrayBuffer>> });
  } catch (err) {
    throw refuse('unreadable', `${c.main.originalname} could not be read: ${(err as Error).message}`);
  }
}

/** A .gltf's buffers packed into one, so it can be stored and served as a single .glb. */
async function packAsGlb(doc: Document): Promise<Uint8Array> {
  const root = doc.getRoot();
  const [first, ...rest] = root.listBuffers();
  if (first) {
    for (const accessor of root.listAccessors()) accessor.setBuffer(first);
    for (const buffer of rest) buffer.dispose();
  }
  return memoryNodeIO().writeBinary(doc);
}

function meshStats(doc: Document): { meshes: number; vertices: number } {
  const meshes = doc.getRoot().listMeshes();
  let vertices = 0;
  for (const mesh of meshes) for (const p of mesh.listPrimitives()) vertices += p.getAttribute('POSITION')?.getCount() ?? 0;
  return { meshes: meshes.length, vertices };
}

/** "127 errors: 122 harmless to walking, 5 on the mesh only". */
function validatorSummary(validator: ImportReport['validator'], groups: ValidatorFindingGroup[]): string {
  const errors = groups.filter((g) => g.severity === 'error');
  const count = (m: string) => errors.filter((g) => g.meaning === m).reduce((n, g) => n + g.count, 0);
  const parts = [
    count('harmless') ? `${count('harmless')} harmless to walking` : '',
    count('mesh') ? `${count('mesh')} on the mesh only` : '',
  ].filter(Boolean);
  const listed = parts.length ? ` (of those listed: ${parts.join(', ')})` : '';
  return `The glTF validator found ${validator.errors} error${validator.errors > 1 ? 's' : ''}${listed}. None affects the skeleton, so Treadle walks it; game engines may still refuse the file. Each group below names the glTF rule it breaks.`;
}

interface Surroundings {
  above: ImportedSkeleton['above'];
  /** Names of skinned-mesh nodes that hang under another node. */
  nestedMeshes: { mesh: string; parent: string }[];
  unit: LengthUnit;
}

/** Notes on how the file places its skeleton: a converting root node, a skinned mesh below the root. */
function placementNotes(s: Surroundings, heightMetres: number): ImportNote[] {
  const notes: ImportNote[] = [];
  if (s.above.names.length) {
    const root = s.above.names.map((n) => `"${n}"`).join(' → ');
    const conversion = rootConversionOf(s.above.matrix);
    if (conversion.turnsZUp) {
      notes.push({
        code: 'root_converts_axes',
        severity: 'info',
        message: `The skeleton was authored Z-up: the node ${root} above it turns +Z up into glTF's +Y up. Treadle reads the skeleton through that node, as glTF defines, so it stands upright. Nothing to do.`,
      });
    }
    if (conversion.scale !== null && Math.abs(conversion.scale - 1) > 1e-6) {
      const unit = Math.abs(conversion.scale - 0.01) < 1e-9 ? ' (centimetres to metres)' : Math.abs(conversion.scale - 0.001) < 1e-9 ? ' (millimetres to metres)' : '';
      notes.push({
        code: 'root_converts_units',
        severity: 'info',
        message: `The node ${root} above the skeleton scales it by ${Number(conversion.scale.toPrecision(6))}${unit}; read through it, the skeleton is ${formatLength(heightMetres)} tall. Nothing to do.`,
      });
    }
  }
  for (const m of s.nestedMeshes) {
    notes.push({
      code: 'skinned_mesh_not_root',
      severity: 'info',
      message: `The skinned mesh "${m.mesh}" hangs under "${m.parent}" instead of the scene root. glTF places a skinned mesh by its joints alone (the transforms above it are ignored), and so do Treadle and three.js. Nothing to do.`,
    });
  }
  return notes;
}

function notesFor(skeleton: Skeleton, positions: Float64Array, detection: LegDetection, height: number, validator: ImportReport['validator'], groups: ValidatorFindingGroup[], s: Surroundings): ImportNote[] {
  const notes: ImportNote[] = [];
  const scale = unitScaleWarning(height);
  if (scale) notes.push({ code: 'unit_scale', severity: 'warning', message: scale });
  if (validator.errors > 0) notes.push({ code: 'validator_errors', severity: 'warning', message: validatorSummary(validator, groups) });
  notes.push(...placementNotes(s, height));
  for (const leg of detection.legs) {
    if (leg.mirrorOf === null && leg.side !== 'centre') {
      notes.push({ code: 'leg_unpaired', severity: 'warning', message: `${leg.name} has no mirror partner on the other side. Check its joints.`, legs: [leg.name] });
    }
    if (leg.confidence < CHECK_CONFIDENCE) {
      notes.push({ code: 'leg_unsure', severity: 'warning', message: `${leg.name} was found with low confidence (${Math.round(leg.confidence * 100)}%). Check it in the leg mapping.`, legs: [leg.name] });
    }
  }
  notes.push(...rigQuirks({ skeleton, positions, legs: detection.legs, unit: s.unit }));
  if (detection.facesMinusZ) {
    notes.push({ code: 'faces_minus_z', severity: 'info', message: 'The joint names say the character faces −Z (glTF fronts face +Z); sides follow the names.' });
  }
  for (const r of detection.rejected) {
    const names = r.joints.map((j) => skeleton.joints[j].name);
    notes.push({ code: 'not_a_leg', severity: 'info', message: `Not taken for a leg: ${names[0]} → ${names[names.length - 1]} (${r.reason}).` });
  }
  return notes;
}

/**
 * A hint when the skeleton would have legs stood up: authored Z-up and exported without converting (glTF 2.0 §3.4
 * defines +Y up). The roots turned by −90° about X map (x, y, z) to (x, z, −y).
 */
function zUpHint(skeleton: Skeleton): string {
  const s = Math.SQRT1_2;
  const turned: Skeleton = {
    joints: skeleton.joints.map((j) => {
      if (j.parent >= 0) return j;
      const [x, y, z, w] = j.rotation;
      // q' = q_x(−90°) · q, with q_x(−90°) = (−s, 0, 0, s).
      const rotation: [number, number, number, number] = [s * (x - w), s * (y + z), s * (z - y), s * (w + x)];
      return { ...j, translation: [j.translation[0], j.translation[2], -j.translation[1]], rotation };
    }),
  };
  return detectLegs(turned).legs.length
    ? ' The skeleton lies along Z: it looks authored Z-up and exported without converting to glTF\'s +Y up. Export with +Y up (or let the exporter add its converting root node) and upload again.'
    : '';
}

/** Reads, validates and analyses an upload in this thread; throws an HttpError refusal naming the problem. */
export async function analyseUpload(files: UploadedFile[], jsonDepth = DEFAULT_JSON_BOUNDS.maxDepth): Promise<ImportedCharacter> {
  if (!files.length) throw refuse('no_file', 'Attach a .glb, or a .gltf with its files, in the field "file".');
  const container = readContainer(files, { ...DEFAULT_JSON_BOUNDS, maxDepth: jsonDepth });
  const { skin } = checkStructure(container.json, supportedExtensions());
  const validator = await validateContainer(container);
  const doc = await readDocument(container);
  const { skeleton, inverseBindMatrices, above } = importSkeleton(doc, skin);
  const positions = jointWorldPositions(skeleton);
  const height = skeletonHeight(positions);
  const guess: UnitGuess | null = guessUnit(height);
  // Evidence is printed in the unit the file looks authored in, so "hangs 42.4 cm" never reads as 42 m.
  const unit: LengthUnit = guess?.certainty === 'likely' ? guess.unit : 'metres';
  const detection = detectLegs(skeleton, { unit });
  if (!detection.legs.length) {
    const why = detection.rejected.length
      ? ` ${detection.rejected.length} chain${detection.rejected.length > 1 ? 's were' : ' was'} considered and set aside (${detection.rejected[0].reason}).`
      : ' No chain of joints reaches down to the lowest part of the skeleton.';
    throw refuse('no_legs', `No leg was found in the skeleton's ${skeleton.joints.length} joints.${why}${zUpHint(skeleton)} A leg is 2–5 joints from the hips down to a foot near the ground.`);
  }
  // Treadle read every inverse bind matrix (finite, one per joint), so a layout finding on them leaves the skeleton whole.
  const groups = groupFindings(validator, container.json, true);
  const broken = skeletonErrors(groups);
  if (broken.length) {
    const first = broken[0];
    throw refuse(
      'skeleton_invalid',
      `The glTF validator found ${broken.reduce((n, g) => n + g.count, 0)} error${broken.length > 1 || first.count > 1 ? 's' : ''} in the skeleton (${first.code}${first.pointers[0] ? ` at ${first.pointers[0]}` : ''}: ${first.message}), so its legs cannot be trusted. See glTF 2.0 ${first.rule.section} (${first.rule.url}); fix it in your exporter and upload again.`,
    );
  }
  const nestedMeshes = doc
    .getRoot()
    .listNodes()
    .filter((n) => n.getSkin() && n.getParentNode())
    .map((n) => ({ mesh: n.getName() || 'unnamed', parent: n.getParentNode()!.getName() || 'unnamed' }));
  const report: ImportReport = {
    validator: { ...validator, groups },
    units: { guess },
    notes: notesFor(skeleton, positions, detection, height, validator, groups, { above, nestedMeshes, unit }),
    stats: { joints: skeleton.joints.length, ...meshStats(doc), height, legs: detection.legs.length },
  };
  const glb = container.format === 'glb' ? new Uint8Array(container.main.buffer) : await packAsGlb(doc);
  return { format: container.format, fileName: container.main.originalname, glb, skeleton, inverseBindMatrices, positions, detection, report };
}
