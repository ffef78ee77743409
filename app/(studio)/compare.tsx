import { useLocalSearchParams, useRouter } from 'expo-router';
import { Screen } from '../../components/layout/Screen';
import { LoadingPage } from '../../components/layout/LoadingPage';
import { EmptyState } from '../../components/ui/EmptyState';
import { Notice } from '../../components/ui/Notice';
import { ComparePicker } from '../../components/compare/ComparePicker';
import { CompareView } from '../../components/compare/CompareView';
import { CompareWalk } from '../../components/compare/CompareWalk';
import { useCompare } from '../../hooks/useCompare';

/** The selection lives in the URL (?suite=…&pick=c1,c2), so a comparison can be shared as a link. */
export default function CompareScreen() {
  const router = useRouter();
  const params = useLocalSearchParams<{ suite?: string; pick?: string }>();
  const picks = (params.pick ?? '').split(',').filter(Boolean);
  const suite = params.suite && /^\d+$/.test(params.suite) ? Number(params.suite) : null;
  const result = useCompare(suite, picks);
  return (
    <Screen title="Compare" lede="Two to four characters, or versions of one, over the same suite.">
      <ComparePicker
        suite={params.suite}
        picks={picks}
        onSuite={(s) => router.setParams({ suite: s })}
        onPicks={(p) => router.setParams({ pick: p.join(',') })}
      />
      {suite === null || picks.length < 2 ? (
        <EmptyState heading="Pick a suite and two to four characters" body="Treadle walks each over the same courses and shows who stumbles where, whose feet overshoot and whose gait settles slowest." />
      ) : null}
      {result.isFetching && !result.data ? <LoadingPage /> : null}
      {result.isError ? <Notice message={result.error.message} /> : null}
      {result.data ? <CompareView result={result.data} /> : null}
      {result.data ? <CompareWalk result={result.data} /> : null}
    </Screen>
  );
}
