import { Link, useRouter } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { Character } from '../../schemas/characters';
import type { TrialSummary } from '../../schemas/trials';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import type { StarterCoursesResponse } from '../../schemas/starter-courses';
import { Screen } from '../layout/Screen';
import { EmptyState } from '../ui/EmptyState';
import { formatMoment } from '../ui/format';
import { footingTrends, type FootingTrend } from './footing-trend';
import { ScoreSparkline } from './ScoreSparkline';
import { NextSteps } from './NextSteps';

/** "leg setup v2", or what ran when no saved version did. */
const setupLabel = (t: TrialSummary) => (t.legSetupVersion === null ? 'an unsaved leg setup' : `leg setup v${t.legSetupVersion}`);

function Change({ trend }: { trend: FootingTrend }) {
  const { change, previous, latest } = trend;
  if (change === null || !previous) return <Text style={styles.changeFlat}>First trial on {latest.courseName}</Text>;
  const rounded = Math.round(change * 10) / 10;
  const since = `the last trial on ${latest.courseName} (${setupLabel(previous)})`;
  if (rounded === 0) return <Text style={styles.changeFlat}>± 0.0: same as {since}</Text>;
  // The sign and the word carry the direction; colour only adds to it.
  return (
    <Text style={rounded > 0 ? styles.changeUp : styles.changeDown}>
      {rounded > 0 ? '▲ +' : '▼ −'}
      {Math.abs(rounded).toFixed(1)} {rounded > 0 ? 'better' : 'worse'} than {since}
    </Text>
  );
}

function CharacterFooting({ character, trend }: { character: Character; trend?: FootingTrend }) {
  const router = useRouter();
  const score = trend ? `${trend.latest.footingScore.toFixed(1)} on ${trend.latest.courseName} with ${setupLabel(trend.latest)}` : 'no trial yet';
  return (
    <View style={styles.card} aria-label={`${character.name} footing`}>
      {/* The whole card opens the character; the trial link below is a target of its own, not nested inside. */}
      <Pressable
        role="link"
        accessibilityLabel={`${character.name}: ${score}. Open the character`}
        onPress={() => router.push(`/characters/${character.id}`)}
        style={({ pressed }) => [styles.cardMain, pressed && styles.pressed]}
      >
        <View style={styles.cardHead}>
          <Text style={styles.name}>{character.name}</Text>
          <Text style={styles.meta}>{character.legCount} legs</Text>
        </View>
        {trend ? (
          <>
            <View style={styles.scoreRow}>
              <View style={styles.scoreText}>
                <Text style={styles.scoreLabel}>Footing score on one course</Text>
                <Text style={styles.score}>{trend.latest.footingScore.toFixed(1)}</Text>
                <Text style={styles.scoreOf} aria-label={`Score of ${trend.latest.courseName}, ${setupLabel(trend.latest)}`}>
                  {trend.latest.courseName} · {setupLabel(trend.latest)}
                </Text>
              </View>
              <ScoreSparkline scores={trend.scores} course={trend.latest.courseName} />
            </View>
            <Change trend={trend} />
            {trend.otherCourses.length ? (
              <Text style={styles.meta}>
                Latest on other courses: {trend.otherCourses.map((t) => `${t.courseName} ${t.footingScore.toFixed(1)} (${setupLabel(t)})`).join(', ')}
              </Text>
            ) : null}
            <Text style={styles.meta}>Run {formatMoment(trend.latest.createdAt)}</Text>
          </>
        ) : (
          <Text style={styles.meta}>No trial yet. Open its leg setup to run one.</Text>
        )}
      </Pressable>
      {trend ? (
        <Link href={`/trials/${trend.latest.id}`} style={styles.trialLink} accessibilityLabel={`Open ${character.name}'s latest trial, on ${trend.latest.courseName}`}>
          Open this trial →
        </Link>
      ) : null}
    </View>
  );
}

/** Each character's latest footing score and its trend, under the first steps a new studio takes. */
export function HomeOverview({
  teamName,
  characters: list,
  trials,
  courseCount,
  mayEditCourses,
  addStarters,
}: {
  teamName: string | undefined;
  characters: Character[];
  trials: TrialSummary[];
  /** Undefined while the course list loads. */
  courseCount: number | undefined;
  mayEditCourses: boolean;
  addStarters: Mutation<void, StarterCoursesResponse>;
}) {
  const trends = footingTrends(trials);
  return (
    <Screen title="Home" lede={teamName ? `${teamName}: each character's latest trial, scored 0–100 (higher is steadier), against its last trial on the same course.` : undefined}>
      <NextSteps characters={list} hasTrial={trials.length > 0} courseCount={courseCount} mayEditCourses={mayEditCourses} addStarters={addStarters} />
      {list.length === 0 ? (
        <EmptyState
          heading="No characters walking yet"
          body="Each character you bring will show here with its latest footing score and how it has moved since the last trial."
        />
      ) : (
        <View style={styles.grid}>
          {list.map((c) => (
            <CharacterFooting key={c.id} character={c} trend={trends.get(c.id)} />
          ))}
        </View>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  card: {
    flexGrow: 1,
    flexBasis: 300,
    backgroundColor: colors.card,
    borderRadius: radius.lg,
    borderWidth: 1,
    borderColor: colors.rule,
    overflow: 'hidden',
  },
  cardMain: { padding: space.lg, paddingBottom: space.sm, gap: space.sm },
  pressed: { backgroundColor: colors.paperDeep },
  cardHead: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline' },
  name: { ...type.heading, color: colors.ink },
  meta: { ...type.small, color: colors.graphite },
  trialLink: {
    minHeight: touchTarget,
    lineHeight: touchTarget,
    paddingHorizontal: space.lg,
    borderTopWidth: 1,
    borderTopColor: colors.rule,
    color: colors.ember,
    fontFamily: fonts.bodyStrong,
    fontSize: 15,
  },
  scoreRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end' },
  scoreLabel: { ...type.small, color: colors.graphite },
  scoreText: { flexShrink: 1 },
  score: { fontFamily: fonts.monoMedium, fontSize: 34, lineHeight: 40, color: colors.ink },
  scoreOf: { ...type.small, color: colors.ink, fontFamily: fonts.bodyMedium },
  changeUp: { fontFamily: fonts.mono, fontSize: 13, color: colors.moss },
  changeDown: { fontFamily: fonts.mono, fontSize: 13, color: colors.danger },
  changeFlat: { fontFamily: fonts.mono, fontSize: 13, color: colors.graphite },
});
