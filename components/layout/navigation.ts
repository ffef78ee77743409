import { sections, type Section } from '../../constants/sections';

/** The section a path belongs to: "/" is Home, "/characters/12" is Characters. */
export function sectionOfPath(pathname: string): Section {
  const first = pathname.split('/').filter(Boolean)[0] ?? '';
  return sections.find((s) => s.href === `/${first}`) ?? sections[0];
}
