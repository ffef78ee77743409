/**
 * The package's version: its major is the leg-profile schema version it reads (the number ending the schema's
 * $id), so a game's `treadle-runtime@1` reads every `leg-profile:1` file. RUNTIME_RELEASE counts the package's
 * own releases within that schema version. The build writes RUNTIME_VERSION into the packed package.json; a
 * test fails when packages/runtime/package.json says otherwise.
 */
import { LEG_PROFILE_SCHEMA_ID } from '../../../engine/profile/schema';

export const RUNTIME_RELEASE = '0.0';
export const PROFILE_SCHEMA: string = LEG_PROFILE_SCHEMA_ID;
export const PROFILE_SCHEMA_VERSION: number = Number(LEG_PROFILE_SCHEMA_ID.slice(LEG_PROFILE_SCHEMA_ID.lastIndexOf(':') + 1));
export const RUNTIME_VERSION: string = `${PROFILE_SCHEMA_VERSION}.${RUNTIME_RELEASE}`;
export const RUNTIME_PACKAGE = 'treadle-runtime';
/** The file `npm pack` writes. */
export const RUNTIME_TARBALL: string = `${RUNTIME_PACKAGE}-${RUNTIME_VERSION}.tgz`;
