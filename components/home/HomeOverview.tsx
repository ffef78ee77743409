import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import type { Character } from '../../schemas/characters';
import { colors, fonts, radius, space, type } from '../../constants/theme';
import { useCharacters } from '../../hooks/useCharacters';
import { useRecentTrials } from '../../hooks/useHome';
import { useMe } from '../../hooks/useSession';
import { Screen } from '../layout/Screen';
import { LoadingPage } from '../layout/LoadingPage';
import { EmptyState } from '../ui/EmptyState';
import { formatMoment } from '../ui/format';
import { footingTrends, type FootingTrend } from './footing-trend';
import { ScoreSparkline } from './ScoreSparkline';
import { NextSteps } from './NextSteps';

function Change({ change }: { change: number | null }) {
  if (change === null) return <Text style={styles.changeFlat}>first trial</Text>;
  const rounded = Math.round(change * 10) / 10;
  if (rounded === 0) return <Text style={styles.changeFlat}>± 0.0 since the last trial</Text>;
  // The sign and the word carry the direction; colour only adds to it.
  return (
    <Text style={rounded > 0 ? styles.changeUp : styles.changeDown}>
      {rounded > 0 ? '▲ +' : '▼ −'}
      {Math.abs(rounded).toFixed(1)} {rounded > 0 ? 'better' : 'worse'} than the last trial
    </Text>
  );
}

function CharacterFooting({ character, trend }: { character: Character; trend?: FootingTrend }) {
  return (
    <View style={styles.card} aria-label={`${character.name} footing`}>
      <View style={styles.cardHead}>
        <Link href={`/characters/${character.id}`} style={styles.name}>
          {character.name}
        </Link>
        <Text style={styles.meta}>{character.legCount} legs</Text>
      </View>
      {trend ? (
        <>
          <View style={styles.scoreRow}>
            <View>
              <Text style={styles.scoreLabel}>Footing score</Text>
              <Text style={styles.score}>{trend.latest.footingScore.toFixed(1)}</Text>
            </View>
            <ScoreSparkline scores={trend.scores} />
          </View>
          <Change change={trend.change} />
          <Text style={styles.meta}>
            Latest: {trend.latest.courseName}, {formatMoment(trend.latest.createdAt)} ·{' '}
            <Link href={`/trials/${trend.latest.id}`} style={styles.link}>
              open trial
            </Link>
          </Text>
        </>
      ) : (
        <Text style={styles.meta}>No trial yet. Open its leg setup to run one.</Text>
      )}
    </View>
  );
}

export function HomeOverview() {
  const me = useMe();
  const characters = useCharacters();
  const trials = useRecentTrials();
  if (characters.isPending || trials.isPending) return <LoadingPage />;
  if (characters.isError) return <LoadingPage problem={characters.error.message} onRetry={() => characters.refetch()} />;
  const trends = footingTrends(trials.data?.trials ?? []);
  const list = characters.data.characters;
  return (
    <Screen title="Home" lede={me.data ? `${me.data.team.name}: how every character's footing is doing (0–100, higher is steadier).` : undefined}>
      <NextSteps characters={list} hasTrial={(trials.data?.trials.length ?? 0) > 0} />
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
    padding: space.lg,
    gap: space.sm,
  },
  cardHead: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline' },
  name: { ...type.heading, color: colors.ink, textDecorationLine: 'underline', textDecorationColor: colors.rule },
  meta: { ...type.small, color: colors.graphite },
  link: { color: colors.ember, fontFamily: fonts.bodyStrong },
  scoreRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-end' },
  scoreLabel: { ...type.small, color: colors.graphite },
  score: { fontFamily: fonts.monoMedium, fontSize: 34, lineHeight: 40, color: colors.ink },
  changeUp: { fontFamily: fonts.mono, fontSize: 13, color: colors.moss },
  changeDown: { fontFamily: fonts.mono, fontSize: 13, color: colors.danger },
  changeFlat: { fontFamily: fonts.mono, fontSize: 13, color: colors.graphite },
});
