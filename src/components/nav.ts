/** The sections of the app, in the order of the work, and who sees each. */
import type { Permission } from '../server/authz';

export interface NavItem {
  href: string;
  label: string;
  permission: Permission;
  /** One line on what the section is for (shown on placeholders and the start page). */
  purpose: string;
  group: 'work' | 'admin';
}

export const NAV: NavItem[] = [
  { href: '/', label: 'Region board', permission: 'inventory:read', group: 'work', purpose: 'Totals and intensity per installation against its target path, data freshness and the top of the shortlist.' },
  { href: '/installations', label: 'Installations', permission: 'inventory:read', group: 'work', purpose: 'Sites, their buildings and meters.' },
  { href: '/buildings', label: 'Buildings', permission: 'inventory:read', group: 'work', purpose: 'Every building in your reach, with its use type, floor area and meters.' },
  { href: '/intake', label: 'Bill intake', permission: 'bills:import', group: 'work', purpose: 'Load utility bills from CSV or Green Button files, check them in a dry run, commit or undo.' },
  { href: '/weather', label: 'Weather', permission: 'inventory:read', group: 'work', purpose: 'Weather stations, daily temperature coverage and degree days.' },
  { href: '/baselines', label: 'Baselines', permission: 'bills:read', group: 'work', purpose: 'Weather-normalized baselines per building and commodity, their statistics and review.' },
  { href: '/shortlist', label: 'Shortlist', permission: 'shortlist:read', group: 'work', purpose: 'Buildings ranked by audit priority, with the reasons, and flags for a walkthrough.' },
  { href: '/walkthroughs', label: 'Walkthroughs', permission: 'walkthroughs:read', group: 'work', purpose: 'Plan walkthrough audits, fill in the field form, record findings and their savings.' },
  { href: '/kits', label: 'Kit library', permission: 'kits:read', group: 'work', purpose: 'Loaner instrument kits, reservations and loans.' },
  { href: '/targets', label: 'Targets', permission: 'inventory:read', group: 'work', purpose: 'Intensity reduction targets per installation, progress and projection.' },
  { href: '/admin/users', label: 'People', permission: 'users:manage', group: 'admin', purpose: 'Accounts, roles and installation assignments.' },
  { href: '/admin/outbox', label: 'Outbox', permission: 'outbox:read', group: 'admin', purpose: 'Every message Plumbline sent.' },
  { href: '/admin/activity', label: 'Activity', permission: 'activity:read', group: 'admin', purpose: 'Who did what, when.' },
];
