import { useEffect, useMemo, useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { LegSetup } from '../../engine/gait/leg-setup';
import type { Rig } from '../../engine/gait/rig';
import { STUMBLE_KINDS, type StumbleKind } from '../../engine/metrics/stumble-thresholds';
import { colors, fonts, space, type } from '../../constants/theme';
import type { PreviewCourse } from '../../hooks/usePreviewCourse';
import { ChoiceChips } from '../ui/ChoiceChips';
import { Notice } from '../ui/Notice';
import { StumbleGlyph } from '../trial/StumbleGlyph';
import { STUMBLE_LABELS } from '../trial/stumble-glyphs';
import { WalkView } from '../trial/WalkView';
import { createLiveWalk, type LiveWalk } from './live-walk';

/**
 * The same engine as a trial of record, running in the browser at display rate with the form's current
 * setup over a chosen course; a change in the form restarts it at once. The stored trial stays the number
 * of record: these counts are a preview.
 */
export function LivePreview({ rig, setup, problem, ground, compact = false }: { rig: Rig; setup: LegSetup | null; problem: string | null; ground: PreviewCourse; compact?: boolean }) {
  const { list, courseId, setCourseId, next: nextCourse, name: shownName, heightfield } = ground;
  const [error, setError] = useState<string | null>(null);
  const walk = useMemo<LiveWalk | null>(() => {
    if (!heightfield || !setup) return null;
    try {
      setError(null);
      return createLiveWalk(rig, setup, heightfield);
    } catch (err) {
      setError((err as Error).message);
      return null;
    }
  }, [rig, setup, heightfield]);
  const walkRef = useRef(walk);
  walkRef.current = walk;
  const [counts, setCounts] = useState<Record<StumbleKind, number> | null>(null);
  useEffect(() => {
    const timer = setInterval(() => setCounts(walkRef.current?.counts() ?? null), 500);
    return () => clearInterval(timer);
  }, []);

  const viewHeight = compact ? 150 : 260;
  // Compact (the phone's sticky strip): one button steps through the courses instead of a row of chips.
  return (
    <View style={[styles.wrap, compact && styles.wrapCompact]} testID="live-preview">
      {compact ? (
        <View style={styles.compactHead}>
          <Text style={styles.compactTitle} numberOfLines={1}>
            Live preview{shownName ? ` · ${shownName}` : ''}
          </Text>
          {list.length > 1 ? (
            <Pressable onPress={nextCourse} role="button" accessibilityLabel="Preview on the next course" style={styles.nextCourse}>
              <Text style={styles.nextCourseText}>Next course ›</Text>
            </Pressable>
          ) : null}
        </View>
      ) : (
        <ChoiceChips label="Preview course" choices={list.map((c) => ({ value: String(c.id), label: c.name }))} value={courseId} onChange={setCourseId} />
      )}
      {heightfield && walk ? (
        <WalkView course={heightfield} rig={rig} animating revision={0} poseAt={() => walkRef.current?.advance(performance.now()) ?? null} height={viewHeight} label="Live preview of the walk with the settings in the form" />
      ) : (
        <View style={[styles.placeholder, { height: viewHeight }]}>
          <Text style={styles.note}>{ground.loaded && !list.length ? 'Make a course to preview the walk on.' : 'Loading the course…'}</Text>
        </View>
      )}
      {problem ? <Notice tone="info" message={`The preview keeps the last valid settings: ${problem}`} /> : null}
      {error ? <Notice message={error} /> : null}
      <View style={[styles.counts, compact && styles.countsCompact]}>
        {STUMBLE_KINDS.map((k) => (
          <View key={k} style={styles.count}>
            <StumbleGlyph kind={k} />
            <Text style={styles.countText}>
              {STUMBLE_LABELS[k]} <Text style={styles.fig}>{counts ? counts[k] : 0}</Text>
            </Text>
          </View>
        ))}
      </View>
      {compact ? null : <Text style={styles.note}>Preview only: run a trial for figures of record.</Text>}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  wrapCompact: { gap: space.xs },
  compactHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  compactTitle: { ...type.label, color: colors.ink, flexShrink: 1 },
  nextCourse: { minHeight: 44, paddingHorizontal: space.sm, justifyContent: 'center' },
  nextCourseText: { ...type.label, color: colors.ember },
  countsCompact: { gap: space.sm },
  placeholder: { height: 260, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.paperDeep, borderRadius: 16 },
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  count: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  countText: { ...type.small, color: colors.ink },
  fig: { fontFamily: fonts.mono },
  note: { ...type.small, color: colors.graphite },
});
