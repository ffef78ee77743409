import { StyleSheet, Text, View } from 'react-native';
import type { DialInAllowance } from '../../schemas/dial-in-allowance';
import { colors, fonts, radius, space, type } from '../../constants/theme';

const n = (v: number) => v.toLocaleString();

/**
 * What a dial-in will cost, before it starts: candidates × courses trials, and the candidates against what is
 * left of the month's allowance (the plan counts candidates; each walks every course of the suite).
 */
export function DialInCost({ candidates, courses, allowance }: { candidates: number; courses: number | null; allowance: DialInAllowance | null }) {
  if (!Number.isInteger(candidates) || candidates <= 0) return null;
  const left = allowance ? Math.max(0, allowance.limit - allowance.used) : null;
  const over = left !== null && candidates > left;
  return (
    <View style={[styles.box, over && styles.over]} testID="dial-in-cost" aria-label="Cost of this dial-in">
      <Text style={styles.line}>
        Cost: <Text style={styles.fig}>{n(candidates)}</Text> candidates
        {courses ? (
          <>
            {' '}× <Text style={styles.fig}>{courses}</Text> {courses === 1 ? 'course' : 'courses'} = <Text style={styles.fig}>{n(candidates * courses)}</Text> trials
          </>
        ) : null}
        .
      </Text>
      {allowance ? (
        <Text style={styles.line}>
          This month ({allowance.planName} plan): <Text style={styles.fig}>{n(allowance.used)}</Text> of <Text style={styles.fig}>{n(allowance.limit)}</Text> dial-in candidates used,{' '}
          <Text style={styles.fig}>{n(left!)}</Text> left; this one would leave <Text style={styles.fig}>{over ? 0 : n(left! - candidates)}</Text>.
        </Text>
      ) : (
        <Text style={styles.line}>Reading this month’s allowance…</Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs, padding: space.md, borderRadius: radius.sm, backgroundColor: colors.paperDeep },
  over: { borderLeftWidth: 4, borderLeftColor: colors.danger },
  line: { ...type.small, color: colors.ink },
  fig: { fontFamily: fonts.monoMedium },
});
