import { Platform, StyleSheet, Text, View } from 'react-native';
import { Link } from 'expo-router';
import { colors, fonts, space, type } from '../../constants/theme';
import { LEG_PROFILE_SCHEMA_URL } from '../../hooks/useProfiles';
import { CopyBlock } from './CopyBlock';
import { RUNTIME_TARBALL, RUNTIME_VERSION } from '../../packages/runtime/src/version';

/** Where Treadle serves the runtime package and the sample game (server/routes/runtime.ts). */
export const RUNTIME_PATH = `/api/runtime/${RUNTIME_TARBALL}`;
export const samplePath = (profileId: number) => `/api/runtime/sample/${profileId}`;

/** The short example packages/runtime/README.md shows too: load, bind by joint names, drive and update each frame. */
export const RUNTIME_SNIPPET = `import { loadLegProfile, bindLegProfile, createLegRuntime, skeletonFromBones, courseGround } from 'treadle-runtime';

const bones = skinnedMesh.skeleton.bones;            // three.js: the character's skin from GLTFLoader
const legs = createLegRuntime(
  bindLegProfile(loadLegProfile(profileJson), skeletonFromBones(bones)), // validates; joints by name
  courseGround(courseJson),                          // or your own (x, z, normal) => height query
);
function onFrame(dt) {
  legs.drive(vx, vz, turnRate);                      // the velocity the player asks for
  legs.update(dt);                                   // same gait and solver code as Treadle's trials
  root.matrix.fromArray(legs.characterMatrix(m));    // where the character stands
  legs.legNames.forEach((_, i) => legs.jointIndices(i).forEach((bone, k) => pose(bones[bone], legs.jointWorldMatrix(i, k, m))));
}                                                    // pose(): the package's sample/game.js`;

const origin = () => (Platform.OS === 'web' && typeof window !== 'undefined' ? window.location.origin : 'https://treadle.example');

/** How a build gets the profile: commands with a token, the schema and the runtime. */
/** Where the one-file command is served (server/cli/bundle.ts): plain Node 20+, no install, no Treadle checkout. */
export const CLI_PATH = '/api/cli/treadle.mjs';

export function BuildUse({ profileId, fileName, mayManageTokens }: { profileId: number; fileName: string; mayManageTokens: boolean }) {
  const env = `TREADLE_URL=${origin()} TREADLE_TOKEN=<your API token>`;
  const cliUrl = `${origin()}${CLI_PATH}`;
  return (
    <View style={styles.wrap}>
      <Text style={styles.body}>
        Keep the token in your CI's secret store, never in the repository. {mayManageTokens ? null : 'An owner or programmer creates tokens.'}
      </Text>
      {mayManageTokens ? (
        <Link href="/tokens" style={styles.link}>
          Manage API tokens
        </Link>
      ) : null}
      <Text style={styles.body}>
        The <Text style={styles.mono}>treadle</Text> command is one file with no dependencies; it runs with Node 20 or newer in your game's own repository.
      </Text>
      <Text role="link" accessibilityLabel="Download the treadle command (treadle.mjs)" style={[styles.link, styles.block]} {...(Platform.OS === 'web' ? ({ href: CLI_PATH, hrefAttrs: { download: 'treadle.mjs' } } as object) : {})}>
        Download treadle.mjs
      </Text>
      <CopyBlock label="Get the command (once, or in CI)" text={`curl -fsSo treadle.mjs ${cliUrl}`} />
      <CopyBlock label="Fetch the latest version" text={`${env} node treadle.mjs pull --profile ${profileId} --out ${fileName}`} />
      <CopyBlock label="Fail the build on a stumble regression" text={`${env} node treadle.mjs check --profile ${profileId} --file build/character.glb`} />
      <CopyBlock label="Or with curl" text={`curl -H "Authorization: Bearer $TREADLE_TOKEN" ${origin()}/api/v1/profiles/${profileId}/versions/latest -o ${fileName}`} />
      <Text style={styles.body}>
        Every file validates against the JSON Schema (draft 2020-12):{' '}
        <Text role="link" style={styles.link} {...(Platform.OS === 'web' ? ({ href: LEG_PROFILE_SCHEMA_URL, hrefAttrs: { target: '_blank' } } as object) : {})}>
          leg-profile.json
        </Text>
      </Text>
      <Text style={styles.body}>
        The runtime is a package of its own, <Text style={styles.mono}>treadle-runtime {RUNTIME_VERSION}</Text>: one ES module with type declarations and no dependencies, running the same gait and solver code as the trials.
      </Text>
      <Text role="link" accessibilityLabel={`Download the runtime package (${RUNTIME_TARBALL})`} style={[styles.link, styles.block]} {...(Platform.OS === 'web' ? ({ href: RUNTIME_PATH, hrefAttrs: { download: RUNTIME_TARBALL } } as object) : {})}>
        Download {RUNTIME_TARBALL}
      </Text>
      <CopyBlock label="Install it in your game" text={`curl -fsSO ${origin()}${RUNTIME_PATH}\nnpm install ./${RUNTIME_TARBALL}`} />
      <CopyBlock label="Runtime in a JavaScript or TypeScript game" text={RUNTIME_SNIPPET} />
      <Text role="link" accessibilityLabel="Play the sample game with this profile" style={[styles.link, styles.block]} {...(Platform.OS === 'web' ? ({ href: samplePath(profileId), hrefAttrs: { target: '_blank' } } as object) : {})}>
        Play the sample game with this profile
      </Text>
      <Text style={styles.body}>The sample game is three.js and the runtime package alone: keys or a thumbstick walk your character over your first course.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  body: { ...type.body, color: colors.graphite },
  link: { fontFamily: fonts.bodyStrong, fontSize: 15, color: colors.ember, textDecorationLine: 'underline', minHeight: 44, lineHeight: 44 },
  mono: { fontFamily: fonts.mono },
  block: { alignSelf: 'flex-start' },
});
