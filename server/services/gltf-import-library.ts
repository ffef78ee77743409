/**
 * @gltf-transform/core and /extensions, loaded through Node's own require.
 *
 * Their dependency property-graph ships only as an ES module (.mjs). Node ≥ 20.19 requires it natively, but
 * jest's CommonJS module runtime does not transform node_modules/*.mjs (see transformIgnorePatterns in
 * jest.config.js), so a plain import would break every test file that builds the app. Going through
 * createRequire sidesteps jest's loader; once jest transforms property-graph, these become plain imports.
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

/**
 * NodeIO for bytes in memory. NodeIO's constructor loads node:fs and node:path by dynamic import(), for
 * reading files by path, which jest's runtime refuses without --experimental-vm-modules; the importer
 * never reads by path, so that step is skipped.
 */
export function memoryNodeIO(): InstanceType<Core['NodeIO']> {
  const { NodeIO } = gltfCore();
  class MemoryNodeIO extends NodeIO {
    override async init(): Promise<void> {}
  }
  return new MemoryNodeIO();
}

export function gltfExtensions(): Extensions {
  extensions ??= nodeRequire('@gltf-transform/extensions') as Extensions;
  return extensions;
}
