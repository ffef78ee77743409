import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { colors, space, type } from '../../constants/theme';
import type { CompareResult } from '../../hooks/useCompare';
import { FOOTING_SCORE_FORMULA } from '../../engine/metrics/footing-score';
import { SplitColumns } from '../layout/SplitColumns';
import { Card } from '../ui/Card';
import { SectionHeading } from '../ui/SectionHeading';
import { MetricsTable } from './MetricsTable';
import { OverlayPlot } from './OverlayPlot';
import type { CompareFocus } from './focus';

/**
 * The comparison: the metrics table and the overlaid plots, side by side on a wide screen; `children` are
 * further full-width sections under them (a synchronized walk of the same entries, for one). `focus` is what the
 * cursor points at (in the plot, or the walk's playhead); the plot reports its own through `onFocus`.
 */
export function CompareView({ result, focus, onFocus, children }: { result: CompareResult; focus?: CompareFocus | null; onFocus?: (f: CompareFocus | null) => void; children?: ReactNode }) {
  const n = result.suite.courses.length;
  return (
    <View style={styles.sections}>
      <SplitColumns
        weights={[3, 2]}
        main={
          <Card>
            <SectionHeading>{`On the suite ${result.suite.name}`}</SectionHeading>
            <Text style={styles.of}>
              {`Suite figures pool all ${n} ${n === 1 ? 'course' : 'courses'}; the rows under "Per course" are each course on its own, as its trial shows it.`}
            </Text>
            <MetricsTable entries={result.entries} focus={focus} />
            <Text style={styles.formula}>{FOOTING_SCORE_FORMULA.text}</Text>
          </Card>
        }
        side={
          <Card>
            <SectionHeading>Along the course</SectionHeading>
            <OverlayPlot entries={result.entries} courses={result.suite.courses} focus={focus} onFocus={onFocus} />
          </Card>
        }
      />
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  sections: { gap: space.lg },
  of: { ...type.small, color: colors.ink },
  formula: { ...type.small, color: colors.graphite },
});
