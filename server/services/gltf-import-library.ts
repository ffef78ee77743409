/**
 * The glTF reader and writer the importer, the seed and the fixtures share: @gltf-transform's NodeIO with
 * every Khronos (KHR_*) extension of @gltf-transform/extensions registered.
 *
 * Loaded through a require made by createRequire rather than a static import: under jest, the static import
 * of the babel-transformed package fails at run time ("reading 'get'" inside property-graph), while this path
 * works under jest, tsx and plain Node alike.
 */
import { createRequire } from 'node:module';

type Core = typeof import('@gltf-transform/core');
type Extensions = typeof import('@gltf-transform/extensions');

const nodeRequire = createRequire(__filename);
let core: Core | null = null;
let extensions: Extensions | null = null;

export function gltfCore(): Core {
  core ??= nodeRequire('@gltf-transform/core') as Core;
  return core;
}

function gltfExtensions(): Extensions {
  extensions ??= nodeRequire('@gltf-transform/extensions') as Extensions;
  return extensions;
}

/**
 * NodeIO for bytes in memory, every KHR extension registered. NodeIO's constructor loads node:fs and node:path
 * by dynamic import(), for reading by path, which jest's runtime refuses without --experimental-vm-modules;
 * the importer never reads by path, so that step is skipped.
 */
export function memoryNodeIO(): InstanceType<Core['NodeIO']> {
  const { NodeIO } = gltfCore();
  class MemoryNodeIO extends NodeIO {
    override async init(): Promise<void> {}
  }
  return new MemoryNodeIO().registerExtensions(gltfExtensions().KHRONOS_EXTENSIONS);
}

export function supportedExtensions(): ReadonlySet<string> {
  return new Set(gltfExtensions().KHRONOS_EXTENSIONS.map((e) => e.EXTENSION_NAME));
}
