import { sections, type Section } from '../../constants/sections';

/** The section a path belongs to: "/" is Home, "/characters/12" is Characters. */
export function sectionOfPath(pathname: string): Section {
  const first = pathname.split('/').filter(Boolean)[0] ?? '';
  const home = OWNING_SECTION[first] ?? first;
  return sections.find((s) => s.href === `/${home}`) ?? sections[0];
}

/** Pages outside a section's own folder that still belong to it. */
const OWNING_SECTION: Record<string, string> = { trials: 'characters', tokens: 'team' };
