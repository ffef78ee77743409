import { Screen } from '../../components/layout/Screen';
import { EmptyState } from '../../components/ui/EmptyState';

export default function CompareScreen() {
  return (
    <Screen title="Compare" lede="Two to four characters, or versions of one, over the same suite.">
      <EmptyState
        heading="Nothing to compare yet"
        body="Once characters have trials, pick them and a suite to see who stumbles where, whose feet overshoot and whose gait settles slowest."
      />
    </Screen>
  );
}
