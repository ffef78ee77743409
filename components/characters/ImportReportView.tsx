import { useState } from 'react';
import { Linking, Platform, Pressable, StyleSheet, Text, View } from 'react-native';
import type { FindingMeaning, ImportReport, ValidatorFindingGroup } from '../../schemas/characters';
import { colors, radius, space, touchTarget, type } from '../../constants/theme';
import type { LengthUnit } from '../../engine/rig/skeleton-scale';
import { formatCharacterLength } from './format';

const SEVERITY_COLOR = { error: colors.danger, warning: '#D99A1E', info: colors.graphite, hint: colors.graphite } as const;
const SEVERITY_MARK = { error: '✕', warning: '!', info: 'i', hint: '·' } as const;
const SHOWN_AT_FIRST = 8;

function Count({ label, value, tone }: { label: string; value: number; tone: string }) {
  return (
    <View style={styles.count}>
      <Text style={[styles.countValue, { color: value ? tone : colors.graphite }]}>{value}</Text>
      <Text style={styles.countLabel}>{label}</Text>
    </View>
  );
}

const MEANING_TITLE: Record<FindingMeaning, string> = {
  skeleton: 'Affects the skeleton',
  mesh: 'Affects the mesh only',
  harmless: 'Harmless to walking',
};
const MEANING_COLOR: Record<FindingMeaning, string> = { skeleton: colors.danger, mesh: '#D99A1E', harmless: colors.moss };

/** A link to the glTF 2.0 rule a group of findings breaks. */
function RuleLink({ rule }: { rule: ValidatorFindingGroup['rule'] }) {
  const web = Platform.OS === 'web' ? ({ href: rule.url, hrefAttrs: { target: '_blank', rel: 'noopener noreferrer' } } as object) : {};
  return (
    <Text role="link" style={styles.rule} onPress={Platform.OS === 'web' ? undefined : () => Linking.openURL(rule.url)} {...web}>
      glTF 2.0 §{rule.section}
    </Text>
  );
}

/** The validator's findings by what they mean for walking, each group with the rule it comes from. */
function FindingGroups({ groups }: { groups: ValidatorFindingGroup[] }) {
  const meanings = (['skeleton', 'mesh', 'harmless'] as const).filter((m) => groups.some((g) => g.meaning === m));
  return (
    <View style={styles.list} aria-label="Validator findings by what they mean for walking">
      {meanings.map((meaning) => {
        const mine = groups.filter((g) => g.meaning === meaning);
        const total = mine.reduce((n, g) => n + g.count, 0);
        return (
          <View key={meaning} style={[styles.group, { borderLeftColor: MEANING_COLOR[meaning] }]}>
            <Text style={styles.groupTitle}>
              {MEANING_TITLE[meaning]} · {total} finding{total === 1 ? '' : 's'}
            </Text>
            <Text style={styles.noteText}>{mine[0].explanation}</Text>
            {mine.map((g) => (
              <View key={`${g.code}-${g.severity}`} style={styles.issue}>
                <Text style={[styles.mark, { color: SEVERITY_COLOR[g.severity] }]} accessibilityLabel={g.severity}>
                  {SEVERITY_MARK[g.severity]}
                </Text>
                <View style={styles.issueBody}>
                  <Text style={styles.issueCode}>
                    {g.code} ×{g.count}
                  </Text>
                  <Text style={styles.noteText}>{g.message}</Text>
                  <RuleLink rule={g.rule} />
                </View>
              </View>
            ))}
          </View>
        );
      })}
    </View>
  );
}

/**
 * What the import found: figures, Treadle's own notes, then the Khronos validator's counts and its findings grouped by
 * what they mean for walking (the raw list behind a toggle). Lengths are shown in metres with the unit fix applied.
 */
export function ImportReportView({ report, unitScale = 1, unit = 'metres' }: { report: ImportReport; unitScale?: number; unit?: LengthUnit }) {
  const [all, setAll] = useState(false);
  const { validator, stats } = report;
  // Once the unit fix is stored, the note that asked for it has been answered.
  // Notes about particular legs are shown beside them, in the Legs section.
  const answered = unitScale !== 1 ? report.notes.filter((n) => n.code !== 'unit_scale') : report.notes;
  const notes = answered.filter((n) => !n.legs?.length);
  const besideLegs = answered.length - notes.length;
  const groups = validator.groups;
  const issues = all || !groups ? validator.issues.slice(0, all ? undefined : SHOWN_AT_FIRST) : [];
  return (
    <View style={styles.wrap} aria-label="Import report">
      <View style={styles.stats}>
        <Count label="legs" value={stats.legs} tone={colors.ink} />
        <Count label="joints" value={stats.joints} tone={colors.ink} />
        <Count label="vertices" value={stats.vertices} tone={colors.ink} />
        <View style={styles.count}>
          <Text style={styles.countValue}>{formatCharacterLength(stats.height * unitScale, unit)}</Text>
          <Text style={styles.countLabel}>skeleton height</Text>
        </View>
      </View>
      {besideLegs ? (
        <Text style={styles.noteText}>
          {besideLegs} note{besideLegs > 1 ? 's' : ''} about particular legs {besideLegs > 1 ? 'are' : 'is'} shown beside them, under Legs.
        </Text>
      ) : null}
      {notes.length ? (
        <View style={styles.list}>
          {notes.map((n, i) => (
            <View key={i} style={[styles.note, { borderLeftColor: n.severity === 'warning' ? SEVERITY_COLOR.warning : colors.rule }]}>
              <Text style={styles.noteText}>{n.message}</Text>
            </View>
          ))}
        </View>
      ) : null}
      <Text style={styles.subhead}>glTF validator {validator.version}</Text>
      <View style={styles.stats}>
        <Count label="errors" value={validator.errors} tone={SEVERITY_COLOR.error} />
        <Count label="warnings" value={validator.warnings} tone={SEVERITY_COLOR.warning} />
        <Count label="infos" value={validator.infos} tone={colors.ink} />
        <Count label="hints" value={validator.hints} tone={colors.ink} />
      </View>
      {validator.issues.length === 0 ? <Text style={styles.clean}>The file passes the Khronos glTF validator with nothing to report.</Text> : null}
      {groups?.length ? <FindingGroups groups={groups} /> : null}
      <View style={styles.list}>
        {issues.map((issue, i) => (
          <View key={i} style={styles.issue}>
            <Text style={[styles.mark, { color: SEVERITY_COLOR[issue.severity] }]} accessibilityLabel={issue.severity}>
              {SEVERITY_MARK[issue.severity]}
            </Text>
            <View style={styles.issueBody}>
              <Text style={styles.issueCode}>
                {issue.code}
                {issue.pointer ? `  ${issue.pointer}` : ''}
              </Text>
              <Text style={styles.noteText}>{issue.message}</Text>
            </View>
          </View>
        ))}
      </View>
      {validator.issues.length > (groups ? 0 : SHOWN_AT_FIRST) ? (
        <Pressable role="button" onPress={() => setAll(!all)} style={styles.more}>
          <Text style={styles.moreText}>{all ? (groups ? 'Hide the validator’s list' : 'Show fewer') : `Show all ${validator.issues.length} issues as the validator lists them`}</Text>
        </Pressable>
      ) : null}
      {validator.truncated ? <Text style={styles.noteText}>The validator stopped listing issues after {validator.issues.length}.</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  stats: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xl },
  count: { alignItems: 'flex-end', minWidth: 56 },
  countValue: { ...type.figure, fontSize: 18, color: colors.ink },
  countLabel: { ...type.small, color: colors.graphite },
  subhead: { ...type.label, color: colors.ink },
  list: { gap: space.sm },
  note: { borderLeftWidth: 3, paddingLeft: space.md, paddingVertical: space.xs },
  noteText: { ...type.small, color: colors.ink },
  clean: { ...type.small, color: colors.moss },
  issue: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start' },
  mark: { ...type.figure, width: 16, textAlign: 'center' },
  issueBody: { flex: 1, gap: 2 },
  issueCode: { ...type.figure, fontSize: 12, color: colors.graphite },
  group: { borderLeftWidth: 3, paddingLeft: space.md, paddingVertical: space.xs, gap: space.xs },
  groupTitle: { ...type.label, color: colors.ink },
  rule: { ...type.small, color: colors.ember, textDecorationLine: 'underline' },
  more: { minHeight: touchTarget, justifyContent: 'center', alignSelf: 'flex-start', borderRadius: radius.sm },
  moreText: { ...type.label, color: colors.ember },
});
