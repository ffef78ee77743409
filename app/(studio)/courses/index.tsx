import { Screen } from '../../../components/layout/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';

export default function CoursesScreen() {
  return (
    <Screen title="Courses" lede="Strips of uneven test ground your characters walk over.">
      <EmptyState
        heading="No courses yet"
        body="Start from a generator (flat, ramp, stairs, rubble, curb, trench or a mix), then sculpt it with a finger or the mouse."
        points={['Raise, lower, smooth and flatten brushes', 'Side profile along the walking line', 'Suites: courses run together']}
      />
    </Screen>
  );
}
