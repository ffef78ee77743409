import { useMemo, useState } from 'react';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { Screen } from '../../components/layout/Screen';
import { LoadingPage } from '../../components/layout/LoadingPage';
import { EmptyState } from '../../components/ui/EmptyState';
import { Notice } from '../../components/ui/Notice';
import { ComparePicker } from '../../components/compare/ComparePicker';
import { CompareView } from '../../components/compare/CompareView';
import { CompareWalk } from '../../components/compare/CompareWalk';
import type { CompareFocus } from '../../components/compare/focus';
import { decodeCourse } from '../../engine/course/encoding';
import { useCharacters } from '../../hooks/useCharacters';
import { useCompare } from '../../hooks/useCompare';
import { useCompareWalkers } from '../../hooks/useCompareWalkers';
import { useCourse, useSuites } from '../../hooks/useCourses';
import { useLegSetups } from '../../hooks/useLegSetups';

const NO_ENTRIES: never[] = [];

/**
 * The selection lives in the URL (?suite=…&pick=c1,c2), so a comparison can be shared as a link. What the cursor
 * points at (a plot's point, the walk's playhead) is kept here, so the table beside them can light up its rows.
 */
export default function CompareScreen() {
  const router = useRouter();
  const params = useLocalSearchParams<{ suite?: string; pick?: string }>();
  const picks = (params.pick ?? '').split(',').filter(Boolean);
  const suite = params.suite && /^\d+$/.test(params.suite) ? Number(params.suite) : null;
  const result = useCompare(suite, picks);
  const suites = useSuites();
  const characters = useCharacters();
  const [versionsOf, setVersionsOf] = useState<string>();
  const setups = useLegSetups(versionsOf ? Number(versionsOf) : 0);

  const walkCourses = suites.data?.suites.find((s) => s.id === result.data?.suite.id)?.courses ?? NO_ENTRIES;
  const [walkCourseId, setWalkCourseId] = useState<number>();
  const walkCourse = useCourse(walkCourseId ?? walkCourses[0]?.id ?? 0);
  const heightfield = useMemo(() => (walkCourse.data ? decodeCourse(walkCourse.data.encoding) : null), [walkCourse.data]);
  const walkers = useCompareWalkers(result.data?.entries ?? NO_ENTRIES);
  const [focus, setFocus] = useState<CompareFocus | null>(null);

  return (
    <Screen title="Compare" lede="Two to four characters, or versions of one, over the same suite.">
      <ComparePicker
        suite={params.suite}
        picks={picks}
        onSuite={(s) => router.setParams({ suite: s })}
        onPicks={(p) => router.setParams({ pick: p.join(',') })}
        suites={suites.data?.suites ?? NO_ENTRIES}
        characters={characters.data?.characters ?? NO_ENTRIES}
        versionsOf={versionsOf}
        onVersionsOf={setVersionsOf}
        versions={versionsOf ? setups.data?.versions : undefined}
      />
      {suite === null || picks.length < 2 ? (
        <EmptyState heading="Pick a suite and two to four characters" body="Treadle walks each over the same courses and shows who stumbles where, whose feet overshoot and whose gait settles slowest." />
      ) : null}
      {result.isFetching && !result.data ? <LoadingPage /> : null}
      {result.isError ? <Notice message={result.error.message} /> : null}
      {result.data ? <CompareView result={result.data} focus={focus} onFocus={setFocus} /> : null}
      {result.data ? (
        <CompareWalk
          courses={walkCourses}
          courseId={walkCourseId ?? walkCourses[0]?.id}
          onCourse={setWalkCourseId}
          heightfield={heightfield}
          sources={walkers}
          onInstant={setFocus}
        />
      ) : null}
    </Screen>
  );
}
