import { StyleSheet, Text, View } from 'react-native';
import type { DetectedLeg, LegMapping, SkeletonJointSummary } from '../../schemas/characters';
import { chainLengths } from '../../engine/rig/skeleton-world';
import { legPath } from '../../engine/rig/detect-legs';
import { colors, radius, space, type } from '../../constants/theme';
import type { LengthUnit } from '../../engine/rig/skeleton-scale';
import { DOF_LABEL, formatCharacterLength, formatDegrees, formatMetres, sideColor } from './format';

function limitText(j: LegMapping['joints'][number]): string {
  if (j.dof === 'ball') return `swing ≤ ${formatDegrees(j.limits[0].max)}, twist ${formatDegrees(j.limits[1].min)}…${formatDegrees(j.limits[1].max)}`;
  // Slider strokes are the engine's metres, whatever the file's unit.
  if (j.dof === 'slider') return j.limits.map((l) => `${formatMetres(l.min)}…${formatMetres(l.max)}`).join(', ');
  return j.limits.map((l) => `${formatDegrees(l.min)}…${formatDegrees(l.max)}`).join(', ');
}

/** Each leg with its joints, their DOF kind and limits, segment lengths and reach (in `unit`); the detection's confidence when shown. */
export function LegList({ legs, joints, detected, unit = 'metres' }: { legs: LegMapping[]; joints: SkeletonJointSummary[]; detected?: DetectedLeg[]; unit?: LengthUnit }) {
  const positions = joints.flatMap((j) => j.position);
  return (
    <View style={styles.list} aria-label="Legs">
      {legs.map((leg, i) => {
        const path = legPath(leg);
        const { segments, total } = chainLengths(positions, path);
        const found = detected?.find((d) => d.name === leg.name && d.end === leg.end);
        return (
          <View key={`${leg.name}-${i}`} style={styles.leg}>
            <View style={styles.head}>
              <View style={[styles.swatch, { backgroundColor: sideColor[leg.side] }]} />
              <Text style={styles.name}>{leg.name}</Text>
              <Text style={styles.reach}>{formatCharacterLength(total, unit)}</Text>
            </View>
            {leg.joints.map((j, k) => (
              <View key={k} style={styles.joint}>
                <Text style={styles.jointName} numberOfLines={1}>
                  {joints[j.joint]?.name ?? `joint ${j.joint}`}
                </Text>
                <Text style={styles.dof}>{DOF_LABEL[j.dof]}</Text>
                <Text style={styles.figure}>{formatCharacterLength(segments[k], unit)}</Text>
                <Text style={styles.limits}>{limitText(j)}</Text>
              </View>
            ))}
            <View style={styles.joint}>
              <Text style={styles.jointName} numberOfLines={1}>
                {joints[leg.end]?.name ?? `joint ${leg.end}`}
              </Text>
              <Text style={styles.dof}>End</Text>
            </View>
            {found ? <Text style={styles.confidence}>Found with {Math.round(found.confidence * 100)}% confidence: {found.evidence.join('; ')}.</Text> : null}
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.md },
  leg: { backgroundColor: colors.card, borderWidth: 1, borderColor: colors.rule, borderRadius: radius.md, padding: space.md, gap: space.xs },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  swatch: { width: 12, height: 12, borderRadius: 6 },
  name: { ...type.label, fontSize: 16, color: colors.ink, flex: 1 },
  reach: { ...type.figure, color: colors.ink, textAlign: 'right' },
  joint: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'baseline', columnGap: space.sm, paddingLeft: space.lg },
  jointName: { ...type.small, color: colors.ink, minWidth: 90, flexShrink: 1 },
  dof: { ...type.small, color: colors.graphite, minWidth: 64 },
  figure: { ...type.figure, fontSize: 13, color: colors.ink, minWidth: 64, textAlign: 'right' },
  limits: { ...type.figure, fontSize: 12, color: colors.graphite, flexBasis: '100%', paddingLeft: 0 },
  confidence: { ...type.small, color: colors.graphite, marginTop: space.xs },
});
