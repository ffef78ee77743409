import { StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import type { CompareResult } from '../../hooks/useCompare';
import { useIsWide } from '../../hooks/useLayout';
import { FOOTING_SCORE_FORMULA } from '../../engine/metrics/footing-score';
import { Card } from '../ui/Card';
import { SectionHeading } from '../ui/SectionHeading';
import { MetricsTable } from './MetricsTable';
import { OverlayPlot } from './OverlayPlot';

/** The comparison: the metrics table and the overlaid plots; side by side on a wide screen. */
export function CompareView({ result }: { result: CompareResult }) {
  const wide = useIsWide();
  return (
    <View style={[styles.cols, wide && styles.wide]}>
      <Card style={wide ? styles.tableCol : undefined}>
        <SectionHeading>{`On ${result.suite.name}`}</SectionHeading>
        <MetricsTable entries={result.entries} />
        <Text style={styles.formula}>{FOOTING_SCORE_FORMULA.text}</Text>
      </Card>
      <Card style={wide ? styles.plotCol : undefined}>
        <SectionHeading>Over time</SectionHeading>
        <OverlayPlot entries={result.entries} courses={result.suite.courses} />
      </Card>
    </View>
  );
}

const styles = StyleSheet.create({
  cols: { gap: space.lg },
  wide: { flexDirection: 'row', alignItems: 'flex-start' },
  tableCol: { flex: 3, minWidth: 0 },
  plotCol: { flex: 2, minWidth: 0 },
  formula: { ...type.small, color: colors.graphite },
});
