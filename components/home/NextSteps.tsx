import { Link, type Href } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import type { Character } from '../../schemas/characters';
import { colors, fonts, radius, space, touchTarget, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import type { StarterCoursesResponse } from '../../schemas/starter-courses';
import { StarterCourses } from '../course/StarterCourses';

interface Step {
  key: string;
  done: boolean;
  title: string;
  body: string;
  href: Href;
  action: string;
}

/**
 * What a studio does first, in order, each step a link to where it is done: a character, ground to walk
 * over (one tap for the starter courses), a first trial. Hidden once all three are done.
 */
export function NextSteps({ characters, hasTrial, courseCount, mayEditCourses, addStarters }: { characters: Character[]; hasTrial: boolean; courseCount: number | undefined; mayEditCourses: boolean; addStarters: Mutation<void, StarterCoursesResponse> }) {
  if (courseCount === undefined) return null;
  const hasCourse = courseCount > 0;
  const first = characters[0];
  const steps: Step[] = [
    { key: 'character', done: characters.length > 0, title: 'Bring a character', body: 'Upload a glTF character; Treadle finds its legs.', href: '/characters', action: 'Go to the character list' },
    { key: 'course', done: hasCourse, title: 'Give it ground to walk over', body: 'Add the starter courses in one tap, or build your own.', href: '/courses', action: 'Go to the course list' },
    {
      key: 'trial',
      done: hasTrial,
      title: 'Run its first trial',
      body: first ? `Open ${first.name}'s leg setup and press “Run trial”.` : 'Once a character is here, run it over a course from its leg setup.',
      href: first ? `/characters/setup/${first.id}` : '/characters',
      action: first ? `Open ${first.name}'s leg setup` : 'Go to the character list',
    },
  ];
  if (steps.every((s) => s.done)) return null;
  return (
    <View style={styles.wrap} aria-label="Next steps">
      <Text role="heading" aria-level={2} style={styles.heading}>
        Next steps
      </Text>
      {steps.map((s, i) => (
        <View key={s.key} style={[styles.step, s.done && styles.stepDone]}>
          <Text style={[styles.number, s.done && styles.numberDone]}>{s.done ? '✓' : i + 1}</Text>
          <View style={styles.text}>
            <Text style={styles.title}>
              {s.title}
              {s.done ? <Text style={styles.doneNote}> (done)</Text> : null}
            </Text>
            <Text style={styles.body}>{s.body}</Text>
            {s.done ? null : (
              <Link href={s.href} style={styles.link} aria-label={s.action}>
                {s.action} →
              </Link>
            )}
            {s.key === 'course' && !s.done ? <StarterCourses compact mayEdit={mayEditCourses} add={addStarters} reason="Four starter courses and a suite of them, made for you:" /> : null}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md, padding: space.lg, borderRadius: radius.lg, backgroundColor: colors.card, borderWidth: 1, borderColor: colors.rule },
  heading: { ...type.heading, color: colors.ink },
  step: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start' },
  stepDone: { opacity: 0.7 },
  number: { width: 28, height: 28, borderRadius: 14, textAlign: 'center', lineHeight: 28, backgroundColor: colors.ember, color: colors.onInk, fontFamily: fonts.monoMedium },
  numberDone: { backgroundColor: colors.moss },
  text: { flex: 1, gap: space.xs },
  title: { ...type.label, color: colors.ink },
  doneNote: { color: colors.graphite, fontFamily: fonts.body },
  body: { ...type.small, color: colors.graphite },
  link: { ...type.label, color: colors.ember, minHeight: touchTarget, paddingVertical: space.md, textDecorationLine: 'underline' },
});
