import type { ProfileVersionSummary } from '../../schemas/profiles';

/** What a published score is of: the suite (all its courses pooled) and the leg setup that earned it. */
export function scoreOf(v: Pick<ProfileVersionSummary, 'suiteName' | 'suiteCourseCount' | 'legSetupVersion'>): string {
  const courses = `${v.suiteCourseCount} ${v.suiteCourseCount === 1 ? 'course' : 'courses'}`;
  const setup = v.legSetupVersion === null ? 'an unsaved leg setup' : `leg setup v${v.legSetupVersion}`;
  return `suite ${v.suiteName} (${courses}) · ${setup}`;
}
