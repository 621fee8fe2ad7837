import {
  Calculator,
  ClipboardCheck,
  FileText,
  LayoutDashboard,
  ListOrdered,
  Megaphone,
  SatelliteDish,
  Users,
  type LucideIcon,
} from 'lucide-react';
import { canAccess, type Audience } from '@/features/session/access';
import type { Session } from '@/features/session/api';
import { paths } from '@/lib/paths';

export interface NavItem {
  label: string;
  to: string;
  icon: LucideIcon;
  /** Who sees the item; the router guards the screen for the same audience. */
  audience: Audience;
}

/** The main navigation, in order. Add a screen here and its route in router.tsx. */
export const navItems: readonly NavItem[] = [
  { label: 'Desk', to: paths.desk, icon: LayoutDashboard, audience: 'everyone' },
  { label: 'Calls', to: paths.calls, icon: Megaphone, audience: 'everyone' },
  { label: 'Calculator', to: paths.calculator, icon: Calculator, audience: 'everyone' },
  { label: 'Proposals', to: paths.proposals, icon: FileText, audience: 'signed-in' },
  { label: 'Reviewing', to: paths.reviewing, icon: ClipboardCheck, audience: 'referee' },
  { label: 'Standing', to: paths.standing, icon: ListOrdered, audience: 'chair' },
  { label: 'Operations', to: paths.operations, icon: SatelliteDish, audience: 'staff' },
  { label: 'Accounts', to: paths.accounts, icon: Users, audience: 'admin' },
];

export const visibleNavItems = (session: Session | null | undefined): NavItem[] =>
  navItems.filter((item) => canAccess(session, item.audience));

/** The audience of the navigation item for `path`, so a screen's guard matches its menu entry. */
export function audienceOf(path: string): Audience {
  const item = navItems.find((candidate) => candidate.to === path);
  if (!item) throw new Error(`No navigation item for ${path}`);
  return item.audience;
}
