/**
 * The glTF import's work on untrusted bytes: from uploaded files to a skeleton with detected legs and a report,
 * or a refusal that names the problem. It runs on the import worker thread (server/workers/gltf-import-worker.ts);
 * everything else calls importGltf in gltf-import.ts. Nothing here touches the database or the disk.
 */
import type { Document } from '@gltf-transform/core';
import type { ImportNote, ImportReport } from '../../schemas/characters';
import type { Skeleton } from '../../engine/rig/types';
import { detectLegs, type LegDetection } from '../../engine/rig/detect-legs';
import { jointWorldPositions } from '../../engine/rig/skeleton-world';
import { skeletonHeight, unitScaleWarning } from '../../engine/rig/skeleton-scale';
import { readContainer, type Container, type UploadedFile } from './gltf-import-container';
import { DEFAULT_JSON_BOUNDS } from './gltf-import-json-scan';
import { checkStructure } from './gltf-import-structure';
import { validateContainer } from './gltf-import-validator';
import { importSkeleton } from './gltf-import-skeleton';
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

function notesFor(skeleton: Skeleton, detection: LegDetection, height: number, validator: ImportReport['validator']): ImportNote[] {
  const notes: ImportNote[] = [];
  const scale = unitScaleWarning(height);
  if (scale) notes.push({ code: 'unit_scale', severity: 'warning', message: scale });
  if (validator.errors > 0) {
    notes.push({
      code: 'validator_errors',
      severity: 'warning',
      message: `The glTF validator found ${validator.errors} error${validator.errors > 1 ? 's' : ''}. Treadle read the file anyway, but game engines may not; see the issues below.`,
    });
  }
  for (const leg of detection.legs) {
    if (leg.mirrorOf === null && leg.side !== 'centre') {
      notes.push({ code: 'leg_unpaired', severity: 'warning', message: `${leg.name} has no mirror partner on the other side. Check its joints.` });
    }
    if (leg.confidence < CHECK_CONFIDENCE) {
      notes.push({ code: 'leg_unsure', severity: 'warning', message: `${leg.name} was found with low confidence (${Math.round(leg.confidence * 100)}%). Check it in the leg mapping.` });
    }
  }
  if (detection.facesMinusZ) {
    notes.push({ code: 'faces_minus_z', severity: 'info', message: 'The joint names say the character faces −Z (glTF fronts face +Z); sides follow the names.' });
  }
  for (const r of detection.rejected) {
    const names = r.joints.map((j) => skeleton.joints[j].name);
    notes.push({ code: 'not_a_leg', severity: 'info', message: `Not taken for a leg: ${names[0]} → ${names[names.length - 1]} (${r.reason}).` });
  }
  return notes;
}

/** Reads, validates and analyses an upload in this thread; throws an HttpError refusal naming the problem. */
export async function analyseUpload(files: UploadedFile[], jsonDepth = DEFAULT_JSON_BOUNDS.maxDepth): Promise<ImportedCharacter> {
  if (!files.length) throw refuse('no_file', 'Attach a .glb, or a .gltf with its files, in the field "file".');
  const container = readContainer(files, { ...DEFAULT_JSON_BOUNDS, maxDepth: jsonDepth });
  const { skin } = checkStructure(container.json, supportedExtensions());
  const validator = await validateContainer(container);
  const doc = await readDocument(container);
  const { skeleton, inverseBindMatrices } = importSkeleton(doc, skin);
  const positions = jointWorldPositions(skeleton);
  const detection = detectLegs(skeleton);
  if (!detection.legs.length) {
    const why = detection.rejected.length
      ? ` ${detection.rejected.length} chain${detection.rejected.length > 1 ? 's were' : ' was'} considered and set aside (${detection.rejected[0].reason}).`
      : ' No chain of joints reaches down to the lowest part of the skeleton.';
    throw refuse('no_legs', `No leg was found in the skeleton's ${skeleton.joints.length} joints.${why} A leg is 2–5 joints from the hips down to a foot near the ground.`);
  }
  const height = skeletonHeight(positions);
  const report: ImportReport = {
    validator,
    notes: notesFor(skeleton, detection, height, validator),
    stats: { joints: skeleton.joints.length, ...meshStats(doc), height, legs: detection.legs.length },
  };
  const glb = container.format === 'glb' ? new Uint8Array(container.main.buffer) : await packAsGlb(doc);
  return { format: container.format, fileName: container.main.originalname, glb, skeleton, inverseBindMatrices, positions, detection, report };
}
