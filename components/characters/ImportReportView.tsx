import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { ImportReport } from '../../schemas/characters';
import { colors, radius, space, touchTarget, type } from '../../constants/theme';
import { formatMetres } from './format';

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

/** What the import found: figures, Treadle's own notes, then the Khronos validator's counts and issues. */
export function ImportReportView({ report }: { report: ImportReport }) {
  const [all, setAll] = useState(false);
  const { validator, notes, stats } = report;
  const issues = all ? validator.issues : validator.issues.slice(0, SHOWN_AT_FIRST);
  return (
    <View style={styles.wrap} aria-label="Import report">
      <View style={styles.stats}>
        <Count label="legs" value={stats.legs} tone={colors.ink} />
        <Count label="joints" value={stats.joints} tone={colors.ink} />
        <Count label="vertices" value={stats.vertices} tone={colors.ink} />
        <View style={styles.count}>
          <Text style={styles.countValue}>{formatMetres(stats.height)}</Text>
          <Text style={styles.countLabel}>skeleton height</Text>
        </View>
      </View>
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
      {validator.issues.length > SHOWN_AT_FIRST ? (
        <Pressable role="button" onPress={() => setAll(!all)} style={styles.more}>
          <Text style={styles.moreText}>{all ? 'Show fewer' : `Show all ${validator.issues.length} issues`}</Text>
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
  more: { minHeight: touchTarget, justifyContent: 'center', alignSelf: 'flex-start', borderRadius: radius.sm },
  moreText: { ...type.label, color: colors.ember },
});
