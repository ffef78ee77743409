import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';

/** Where to go from a character: its leg setup with live preview and trials, and the tuner. */
export function CharacterActions({ characterId, mayDialIn }: { characterId: number; mayDialIn: boolean }) {
  return (
    <View style={styles.row}>
      <Link href={`/characters/setup/${characterId}`} style={styles.primary}>
        <Text style={styles.primaryTitle}>Leg setup and trials</Text>
        {'\n'}
        <Text style={styles.primaryBody}>Tune by hand with a live preview, run trials over courses.</Text>
      </Link>
      {mayDialIn && (
        <Link href={`/characters/dial-in/${characterId}`} style={styles.secondary}>
          <Text style={styles.secondaryTitle}>Dial-in</Text>
          {'\n'}
          <Text style={styles.secondaryBody}>Let the tuner search the settings over a suite.</Text>
        </Link>
      )}
    </View>
  );
}

const tile = { flexGrow: 1, flexBasis: 240, minHeight: touchTarget, padding: space.lg, borderRadius: radius.lg } as const;
const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  primary: { ...tile, backgroundColor: colors.ember },
  primaryTitle: { fontFamily: fonts.bodyStrong, fontSize: 16, color: colors.onInk },
  primaryBody: { ...type.small, color: colors.onInk },
  secondary: { ...tile, backgroundColor: colors.card, borderWidth: 1.5, borderColor: colors.ink },
  secondaryTitle: { fontFamily: fonts.bodyStrong, fontSize: 16, color: colors.ink },
  secondaryBody: { ...type.small, color: colors.graphite },
});
