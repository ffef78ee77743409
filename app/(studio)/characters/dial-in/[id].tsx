import { useState } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { DialInPage } from '../../../../components/dialin/DialInPage';
import { useCan } from '../../../../hooks/useCan';
import { useCharacter } from '../../../../hooks/useCharacters';
import { useAddStarterCourses, useSuites } from '../../../../hooks/useCourses';
import { useAcceptDialIn, useDialInAllowance, useStartDialIn } from '../../../../hooks/useDialIn';
import { cancelJob, useJob } from '../../../../hooks/useJobs';
import { useLegSetups } from '../../../../hooks/useLegSetups';
import { useTrials } from '../../../../hooks/useTrials';

export default function DialInScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const characterId = Number(id);
  const mayRun = useCan('dial-ins.run');
  const mayEditCourses = useCan('courses.edit');
  const character = useCharacter(characterId);
  const suites = useSuites();
  const setups = useLegSetups(characterId);
  const allowance = useDialInAllowance(mayRun);
  const start = useStartDialIn();
  const accept = useAcceptDialIn(characterId);
  const [jobId, setJobId] = useState<number | null>(null);
  const job = useJob(jobId);
  const trials = useTrials(characterId);
  const addStarters = useAddStarterCourses();
  return (
    <DialInPage
      characterId={characterId}
      characterName={character.data?.character.name ?? 'Character'}
      mayRun={mayRun}
      mayEditCourses={mayEditCourses}
      suites={suites}
      setups={setups}
      allowance={allowance}
      start={start}
      accept={accept}
      jobId={jobId}
      onJob={setJobId}
      job={job}
      onCancel={cancelJob}
      trials={trials.data?.trials}
      addStarters={addStarters}
    />
  );
}
