/**
 * The Khronos validator's findings grouped by what they mean for walking: harmless (animation data, unused
 * objects, a stride on data Treadle read intact), the mesh only (what is drawn, not what walks), or the skeleton
 * (what Treadle walks; an error there refuses the upload). Each group links the glTF 2.0 rule it comes from.
 * A finding's target is read from its JSON pointer and from what the file uses each accessor for.
 */
import type { FindingMeaning, ImportReport, ValidatorFindingGroup } from '../../schemas/characters';
import type { GltfJson } from './gltf-import-container';

const SPEC = 'https://registry.khronos.org/glTF/specs/2.0/glTF-2.0.html';

/** Sections of the glTF 2.0 specification by the anchor its HTML gives them (section titles as the specification writes them). */
const RULES = {
  bufferViews: { section: '3.6.1 Buffers and Buffer Views', anchor: 'buffers-and-buffer-views-overview' },
  alignment: { section: '3.6.2.4 Data Alignment', anchor: 'data-alignment' },
  bounds: { section: '3.6.2.5 Accessors Bounds', anchor: 'accessors-bounds' },
  accessors: { section: '3.6.2 Accessors', anchor: 'accessors' },
  animations: { section: '3.11 Animations', anchor: 'animations' },
  skins: { section: '3.7.3 Skins', anchor: 'skins' },
  jointHierarchy: { section: '3.7.3.2 Joint Hierarchy', anchor: 'joint-hierarchy' },
  skinnedAttributes: { section: '3.7.3.3 Skinned Mesh Attributes', anchor: 'skinned-mesh-attributes' },
  nodes: { section: '3.5.2 Nodes and Hierarchy', anchor: 'nodes-and-hierarchy' },
  transformations: { section: '3.5.3 Transformations', anchor: 'transformations' },
  scenes: { section: '3.5.1 Scenes', anchor: 'scenes-overview' },
  meshes: { section: '3.7.2 Meshes', anchor: 'meshes-overview' },
  morphTargets: { section: '3.7.2.2 Morph Targets', anchor: 'morph-targets' },
  materials: { section: '3.9 Materials', anchor: 'materials' },
  textures: { section: '3.8 Texture Data', anchor: 'texture-data' },
  glb: { section: '4 GLB File Format Specification', anchor: 'glb-file-format-specification' },
  json: { section: '2.7 JSON Encoding', anchor: 'json-encoding' },
  general: { section: '3.1 Concepts: General', anchor: 'concepts-general' },
} as const;

type RuleKey = keyof typeof RULES;

/** The rule a validator code comes from (its name says the object and the requirement). */
function ruleOf(code: string): RuleKey {
  if (code.startsWith('GLB_')) return 'glb';
  // A stride where none belongs breaks §3.6.1's rule, whichever data the buffer view holds.
  if (code.includes('BYTESTRIDE') || code.includes('BYTE_STRIDE')) return 'bufferViews';
  if (code.startsWith('ANIMATION_') || code.startsWith('ACCESSOR_ANIMATION_')) return 'animations';
  if (code.startsWith('SKIN_') || code === 'INVALID_IBM_ACCESSOR_COUNT' || code === 'ACCESSOR_INVALID_IBM') return 'skins';
  if (code.startsWith('ACCESSOR_JOINTS_') || code.startsWith('ACCESSOR_WEIGHTS_') || code === 'MESH_PRIMITIVE_JOINTS_WEIGHTS_MISMATCH' || code === 'UNUSED_MESH_WEIGHTS') return 'skinnedAttributes';
  if (code.startsWith('NODE_SKIN') || code === 'NODE_SKINNED_MESH_NON_ROOT' || code === 'NODE_SKINNED_MESH_LOCAL_TRANSFORMS') return 'jointHierarchy';
  if (code.includes('BYTESTRIDE') || code.includes('BYTE_STRIDE') || code.startsWith('BUFFER_')) return 'bufferViews';
  if (code.includes('ALIGN')) return 'alignment';
  if (code.includes('MIN_') || code.includes('MAX_') || code.includes('BOUND')) return 'bounds';
  if (code.includes('MORPH')) return 'morphTargets';
  if (code.startsWith('MESH_') || code === 'UNUSED_MESH_TANGENT' || code.startsWith('ACCESSOR_INDEX_')) return 'meshes';
  if (code.startsWith('ACCESSOR_')) return 'accessors';
  if (code.startsWith('NODE_MATRIX') || code === 'ROTATION_NON_UNIT') return 'transformations';
  if (code.startsWith('NODE_')) return 'nodes';
  if (code.startsWith('SCENE_')) return 'scenes';
  if (code.startsWith('MATERIAL_') || code.startsWith('KHR_MATERIALS_')) return 'materials';
  if (code.startsWith('TEXTURE_') || code.startsWith('IMAGE_')) return 'textures';
  if (['INVALID_JSON', 'TYPE_MISMATCH', 'ARRAY_TYPE_MISMATCH', 'UNDEFINED_PROPERTY', 'UNEXPECTED_PROPERTY'].includes(code)) return 'json';
  return 'general';
}

export function ruleUrl(key: RuleKey): { section: string; url: string } {
  return { section: RULES[key].section, url: `${SPEC}#${RULES[key].anchor}` };
}

interface Usage {
  /** Accessors read as the skeleton's inverse bind matrices. */
  ibm: Set<number>;
  /** Accessors read by animation samplers. */
  animation: Set<number>;
  /** Nodes that are joints of a skin, or above one. */
  skeletonNodes: Set<number>;
  /** Buffer views and their accessors' uses. */
  viewUse: Map<number, Set<'ibm' | 'animation' | 'mesh' | 'image'>>;
}

function usageOf(json: GltfJson): Usage {
  const j = json as Record<string, unknown>;
  const skins = (j.skins ?? []) as { joints?: number[]; inverseBindMatrices?: number }[];
  const animations = (j.animations ?? []) as { samplers?: { input?: number; output?: number }[] }[];
  const accessors = (j.accessors ?? []) as { bufferView?: number }[];
  const images = (j.images ?? []) as { bufferView?: number }[];
  const nodes = (j.nodes ?? []) as { children?: number[] }[];
  const ibm = new Set<number>();
  const animation = new Set<number>();
  for (const s of skins) if (typeof s.inverseBindMatrices === 'number') ibm.add(s.inverseBindMatrices);
  for (const a of animations) for (const s of a.samplers ?? []) for (const k of [s.input, s.output]) if (typeof k === 'number') animation.add(k);
  const parent = new Map<number, number>();
  nodes.forEach((n, i) => (Array.isArray(n.children) ? n.children : []).forEach((c) => parent.set(c, i)));
  const skeletonNodes = new Set<number>();
  for (const s of skins) {
    for (const joint of s.joints ?? []) {
      for (let n: number | undefined = joint, guard = 0; n !== undefined && !skeletonNodes.has(n) && guard <= nodes.length; n = parent.get(n), guard++) skeletonNodes.add(n);
    }
  }
  const viewUse = new Map<number, Set<'ibm' | 'animation' | 'mesh' | 'image'>>();
  const use = (view: number | undefined, what: 'ibm' | 'animation' | 'mesh' | 'image') => {
    if (typeof view !== 'number') return;
    if (!viewUse.has(view)) viewUse.set(view, new Set());
    viewUse.get(view)!.add(what);
  };
  accessors.forEach((a, i) => use(a.bufferView, ibm.has(i) ? 'ibm' : animation.has(i) ? 'animation' : 'mesh'));
  for (const im of images) use(im.bufferView, 'image');
  return { ibm, animation, skeletonNodes, viewUse };
}

/** "/accessors/12/min" → ["accessors", 12]. */
function targetOf(pointer: string | undefined): { kind: string; index: number; rest: string } | null {
  const m = /^\/([A-Za-z]+)\/(\d+)(.*)$/.exec(pointer ?? '');
  return m ? { kind: m[1], index: Number(m[2]), rest: m[3] } : null;
}

const EXPLAIN: Record<FindingMeaning, string> = {
  harmless: 'Treadle does not walk with this data (animation clips, unused objects), or read it intact anyway. Nothing to do for Treadle; a strict game engine may still refuse the file.',
  mesh: 'How the character is drawn, not the skeleton Treadle walks. Game engines may refuse it or draw it wrongly; fix it in your exporter.',
  skeleton: 'The joints, their hierarchy or their bind matrices: what Treadle walks. Fix it in your exporter and upload again.',
};

/**
 * What one finding means for walking. `ibmIntact`: Treadle read every inverse bind matrix, finite and of the right
 * count, so a layout finding on them (a stride where none belongs) leaves the skeleton whole.
 */
function meaningOf(issue: { code: string; severity: string; pointer?: string }, usage: Usage, ibmIntact: boolean): FindingMeaning {
  const { code } = issue;
  if (code === 'UNUSED_OBJECT' || code.startsWith('ANIMATION_') || code.startsWith('ACCESSOR_ANIMATION_')) return 'harmless';
  if (code === 'SKIN_IBM_ACCESSOR_WITH_BYTESTRIDE') return ibmIntact ? 'harmless' : 'skeleton';
  const target = targetOf(issue.pointer);
  if (!target) return ruleOf(code) === 'skins' || ruleOf(code) === 'jointHierarchy' ? 'skeleton' : issue.severity === 'error' ? 'mesh' : 'harmless';
  switch (target.kind) {
    case 'skins':
      return code.includes('BYTESTRIDE') && ibmIntact ? 'harmless' : 'skeleton';
    case 'animations':
    case 'cameras':
      return 'harmless';
    case 'nodes':
      if (code === 'NODE_SKINNED_MESH_NON_ROOT' || code === 'NODE_SKINNED_MESH_LOCAL_TRANSFORMS') return 'mesh';
      return usage.skeletonNodes.has(target.index) ? 'skeleton' : 'harmless';
    case 'accessors':
      if (usage.animation.has(target.index)) return 'harmless';
      if (usage.ibm.has(target.index)) return code.includes('STRIDE') && ibmIntact ? 'harmless' : 'skeleton';
      return 'mesh';
    case 'bufferViews': {
      const uses = usage.viewUse.get(target.index);
      if (!uses || (!uses.has('mesh') && !uses.has('image') && (!uses.has('ibm') || ibmIntact))) return 'harmless';
      return uses.has('mesh') || uses.has('image') ? 'mesh' : 'skeleton';
    }
    case 'meshes':
    case 'materials':
    case 'textures':
    case 'images':
    case 'samplers':
      return 'mesh';
    default:
      return issue.severity === 'error' ? 'mesh' : 'harmless';
  }
}

const MEANING_ORDER: FindingMeaning[] = ['skeleton', 'mesh', 'harmless'];
const SEVERITY_ORDER = ['error', 'warning', 'info', 'hint'];
/** Pointers kept per group, as examples. */
const POINTERS_KEPT = 4;

/** The validator's issues grouped by meaning and code, most serious first. */
export function groupFindings(validator: ImportReport['validator'], json: GltfJson, ibmIntact: boolean): ValidatorFindingGroup[] {
  const usage = usageOf(json);
  const groups = new Map<string, ValidatorFindingGroup>();
  for (const issue of validator.issues) {
    const meaning = meaningOf(issue, usage, ibmIntact);
    const key = `${meaning}|${issue.code}|${issue.severity}`;
    let g = groups.get(key);
    if (!g) {
      g = { meaning, code: issue.code, severity: issue.severity, count: 0, message: issue.message, explanation: EXPLAIN[meaning], rule: ruleUrl(ruleOf(issue.code)), pointers: [] };
      groups.set(key, g);
    }
    g.count++;
    if (issue.pointer && g.pointers.length < POINTERS_KEPT) g.pointers.push(issue.pointer);
  }
  return [...groups.values()].sort(
    (a, b) => MEANING_ORDER.indexOf(a.meaning) - MEANING_ORDER.indexOf(b.meaning) || SEVERITY_ORDER.indexOf(a.severity) - SEVERITY_ORDER.indexOf(b.severity) || b.count - a.count || a.code.localeCompare(b.code),
  );
}

/** Validator errors on the skeleton: an upload with any is refused, since its legs could not be trusted. */
export function skeletonErrors(groups: readonly ValidatorFindingGroup[]): ValidatorFindingGroup[] {
  return groups.filter((g) => g.meaning === 'skeleton' && g.severity === 'error');
}
