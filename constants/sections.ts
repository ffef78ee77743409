/** The studio's sections, in the order the tabs and the rail show them. */
export const sections = [
  { href: '/', name: 'index', label: 'Home' },
  { href: '/characters', name: 'characters', label: 'Characters' },
  { href: '/courses', name: 'courses', label: 'Courses' },
  { href: '/compare', name: 'compare', label: 'Compare' },
  { href: '/profiles', name: 'profiles', label: 'Profiles' },
  { href: '/team', name: 'team', label: 'Team' },
] as const;
export type Section = (typeof sections)[number];
