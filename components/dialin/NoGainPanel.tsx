import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { STUMBLE_KINDS } from '../../engine/metrics/stumble-thresholds';
import type { DialInResult } from '../../schemas/dial-ins';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import type { TrialSummary } from '../../schemas/trials';
import { StumbleGlyph } from '../trial/StumbleGlyph';
import { STUMBLE_LABELS } from '../trial/stumble-glyphs';
import { penalties, startStumbles, stopReasonText, type StumbleRates } from './outcome';

interface CourseWhy {
  courseId: number;
  courseName: string;
  score: number;
  rates: StumbleRates | null;
  /** Where the rates come from when the dial-in did not carry them: a stored trial of the same leg setup. */
  trialId: number | null;
}

/**
 * A dial-in that found nothing better than where it started: says so, and shows why, the start's score and
 * stumbles on every course (from the result, or from the newest stored trial of the same leg setup there).
 * No Accept: there is nothing to save.
 */
export function NoGainPanel({ result, trials: characterTrials }: { result: DialInResult; trials: readonly TrialSummary[] | undefined }) {
  const before = result.before!;
  const after = result.after!;
  const why: CourseWhy[] = before.perCourse.map((c) => {
    const own = startStumbles(result, c.courseId);
    if (own) return { courseId: c.courseId, courseName: c.courseName, score: c.footingScore, rates: own, trialId: null };
    const stored = result.baseLegSetupId
      ? (characterTrials ?? []).filter((t) => t.courseId === c.courseId && t.legSetupId === result.baseLegSetupId).sort((a, b) => b.createdAt - a.createdAt)[0]
      : undefined;
    const rates = stored ? (Object.fromEntries(STUMBLE_KINDS.map((k) => [k, stored.metrics.stumbles[k]?.per100Steps ?? 0])) as StumbleRates) : null;
    return { courseId: c.courseId, courseName: c.courseName, score: c.footingScore, rates, trialId: stored?.id ?? null };
  });
  const p = penalties(result);
  const stopped = stopReasonText(result);
  const allZero = before.perCourse.length > 0 && before.perCourse.every((c) => Math.round(c.footingScore * 10) === 0);
  return (
    <View style={styles.box} testID="dial-in-no-gain" role="status">
      <Text role="heading" aria-level={3} style={styles.heading}>
        Nothing better than the start
      </Text>
      <Text style={styles.body}>
        The best of {result.candidatesTried} candidates scored {after.footingScore.toFixed(1)} over the suite, the start {before.footingScore.toFixed(1)}. There is nothing to save, so
        there is no Accept.
      </Text>
      {stopped ? <Text style={styles.body}>The search ended because {stopped}.</Text> : null}
      {p ? (
        <Text style={styles.body}>
          Its penalty P (the score is 100·e^(−P)) went from <Text style={styles.fig}>{p.start.toFixed(2)}</Text> at the start to{' '}
          <Text style={styles.fig}>{p.best.toFixed(2)}</Text> for the best{p.best < p.start ? ': a little steadier, but not enough to move the score' : ''}.
        </Text>
      ) : null}
      {allZero ? (
        <Text style={styles.body}>
          The start scored 0.0 on every course. The score is 100·e^(−penalty), so once stumbles are this frequent it rests at 0 and a better candidate within these
          bounds cannot show. Read the stumbles below: fix the most frequent kind first (reach-miss: iteration budget or damping; scuff: step height; snap: largest
          joint change), or widen the bounds, then dial in again.
        </Text>
      ) : (
        <Text style={styles.body}>Widen the bounds, tune other settings, or give it more candidates.</Text>
      )}
      <Text style={styles.sub}>The start’s stumbles per 100 steps</Text>
      {why.map((c) => (
        <View key={c.courseId} style={styles.course} aria-label={`${c.courseName}: start scored ${c.score.toFixed(1)}`}>
          <View style={styles.courseHead}>
            <Text style={styles.courseName}>{c.courseName}</Text>
            <Text style={styles.fig}>{c.score.toFixed(1)}</Text>
          </View>
          {c.rates ? (
            <View style={styles.rates}>
              {STUMBLE_KINDS.map((k) => (
                <View key={k} style={styles.rate} aria-label={`${STUMBLE_LABELS[k]} ${c.rates![k].toFixed(1)} per 100 steps`}>
                  <StumbleGlyph kind={k} />
                  <Text style={styles.rateText}>
                    {STUMBLE_LABELS[k]} <Text style={styles.fig}>{c.rates![k].toFixed(1)}</Text>
                  </Text>
                </View>
              ))}
            </View>
          ) : (
            <Text style={styles.note}>No stored trial of this leg setup on this course yet: run one from the leg setup page to read its stumbles.</Text>
          )}
          {c.trialId ? (
            <Link href={`/trials/${c.trialId}`} style={styles.link}>
              From trial {c.trialId} of the same leg setup: open it →
            </Link>
          ) : null}
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderLeftWidth: 4, borderLeftColor: colors.graphite, backgroundColor: colors.paperDeep },
  heading: { ...type.heading, color: colors.ink },
  body: { ...type.small, color: colors.ink },
  sub: { ...type.label, color: colors.ink, marginTop: space.sm },
  course: { gap: space.xs, paddingVertical: space.xs, borderTopWidth: 1, borderColor: colors.rule },
  courseHead: { flexDirection: 'row', justifyContent: 'space-between' },
  courseName: { ...type.small, color: colors.ink, fontFamily: fonts.bodyMedium },
  rates: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: space.xs },
  rate: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  rateText: { ...type.small, color: colors.ink },
  fig: { fontFamily: fonts.mono, color: colors.ink },
  note: { ...type.small, color: colors.graphite },
  link: { ...type.small, color: colors.ember, fontFamily: fonts.bodyStrong, paddingVertical: space.sm },
});
