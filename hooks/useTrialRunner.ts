import { useState } from 'react';
import { useCourses, useSuites } from './useCourses';
import { useJob } from './useJobs';
import { useRunTrial } from './useTrials';

/**
 * What running a trial from a screen needs: the courses and suites to pick from, the start, and the job it
 * started as it is polled. A screen calls this and hands it to RunTrialPanel.
 */
export function useTrialRunner() {
  const courses = useCourses();
  const suites = useSuites();
  const run = useRunTrial();
  const [jobId, setJobId] = useState<number | null>(null);
  const job = useJob(jobId);
  return { courses, suites, run, jobId, setJobId, job };
}
export type TrialRunner = ReturnType<typeof useTrialRunner>;
