import { Platform, StyleSheet, Text, View } from 'react-native';
import { Link } from 'expo-router';
import { colors, fonts, space, type } from '../../constants/theme';
import { LEG_PROFILE_SCHEMA_URL } from '../../hooks/useProfiles';
import { CopyBlock } from './CopyBlock';

/** The short example the README shows too: load, bind by joint names, step each frame. */
export const RUNTIME_SNIPPET = `import { loadLegProfile, bindLegProfile, createLegRuntime } from './treadle/engine/profile';

const profile = loadLegProfile(profileJsonText);     // validates; names each problem
const legs = createLegRuntime(
  bindLegProfile(profile, skeleton),                 // joints by name; names each missing one
  groundHeightfield,
);

function onFrame() {
  legs.step();                                       // same gait and solver code as Treadle's trials
  for (let i = 0; i < legs.legNames.length; i++) {
    legs.footPosition(i, foot);
    legs.jointIndices(i).forEach((joint, k) => legs.jointWorldMatrix(i, k, bones[joint]));
  }
}`;

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
      <CopyBlock label="Runtime in a JavaScript or TypeScript game" text={RUNTIME_SNIPPET} />
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
