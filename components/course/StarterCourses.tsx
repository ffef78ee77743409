import { StyleSheet, Text, View } from 'react-native';
import { colors, radius, space, type } from '../../constants/theme';
import type { Mutation } from '../../hooks/mutation';
import type { StarterCoursesResponse } from '../../schemas/starter-courses';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';

/** Names the one tap adds (kept beside the button so it says what it does; the server holds the recipes). */
const STARTER_POINTS = ['Level ground', 'A gentle 6° slope', 'Three steps at building-code size', 'Loose gravel', 'A “Starter suite” holding all four'];

/**
 * The way out of an empty studio: one tap adds four starter courses and a suite of them. `reason` says why the
 * screen needs them (e.g. "Run trial needs ground to walk over"); without the right to make courses it says who can.
 */
export function StarterCourses({ reason, mayEdit, add, compact = false }: { reason: string; mayEdit: boolean; add: Mutation<void, StarterCoursesResponse>; compact?: boolean }) {
  return (
    <View style={[styles.box, compact && styles.compact]} testID="starter-courses">
      <Text style={styles.reason}>{reason}</Text>
      {mayEdit ? (
        <>
          {compact ? null : (
            <View style={styles.points}>
              {STARTER_POINTS.map((p) => (
                <Text key={p} style={styles.point}>
                  · {p}
                </Text>
              ))}
            </View>
          )}
          <Button label="Add starter courses" onPress={() => add.mutate()} busy={add.isPending} />
          {add.isSuccess ? <Notice tone="info" message={add.data.added.length ? `Added ${add.data.added.length} courses and the starter suite.` : 'The starter courses are already here.'} /> : null}
          {add.error ? <Notice message={add.error.message} /> : null}
        </>
      ) : (
        <Text style={styles.point}>An owner or designer adds courses (one tap: “Add starter courses” on Courses).</Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { alignSelf: 'stretch', maxWidth: 560, gap: space.md, padding: space.lg, borderRadius: radius.lg, borderWidth: 1.5, borderColor: colors.ember, backgroundColor: colors.card },
  compact: { padding: space.md },
  reason: { ...type.body, color: colors.ink },
  points: { gap: 2 },
  point: { ...type.small, color: colors.graphite },
});
