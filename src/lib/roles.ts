export const ROLES = ['learner', 'instructor', 'admin'] as const;
export type Role = (typeof ROLES)[number];

/** The signed-in user as pages and endpoints see it (never the password hash). */
export interface SessionUser {
  id: string;
  name: string;
  email: string;
  role: Role;
}

/** Where each role lands after sign-in. */
export function homePathFor(role: Role): string {
  switch (role) {
    case 'learner':
      return '/learn';
    case 'instructor':
      return '/teach';
    case 'admin':
      return '/admin/users';
  }
}

/** Links the top bar shows for a role. */
export function navLinksFor(role: Role): { href: string; label: string }[] {
  switch (role) {
    case 'learner':
      return [
        { href: '/learn', label: 'My bench' },
        { href: '/train', label: 'Practise' },
        { href: '/rework', label: 'Rework' },
        { href: '/progress', label: 'Progress' },
        { href: '/tools/wrench', label: 'Wrench' },
      ];
    case 'instructor':
      return [
        { href: '/teach', label: 'My classes' },
        { href: '/teach/procedures', label: 'Procedures' },
        { href: '/train', label: 'Practise' },
        { href: '/tools/wrench', label: 'Wrench' },
      ];
    case 'admin':
      return [
        { href: '/admin/users', label: 'People' },
        { href: '/teach', label: 'Classes' },
        { href: '/admin/mail', label: 'Sent mail' },
        { href: '/tools/wrench', label: 'Wrench' },
      ];
  }
}

/** The link the top bar marks as the current page: the longest one the path is under (/teach/procedures, not /teach). */
export function currentNavLink(links: readonly { href: string }[], path: string): string | null {
  const under = links.filter((l) => path === l.href || path.startsWith(l.href + '/'));
  return under.sort((a, b) => b.href.length - a.href.length)[0]?.href ?? null;
}
