/**
 * The frame of every signed-in page: skip link, header (brand, current
 * network + switcher, account menu), section navigation for the network,
 * and the main landmark. Server component.
 */
import type { ReactNode } from 'react';
import { Brand } from './Brand';
import { SkipLink } from './SkipLink';
import { NavLinks, type NavItem } from './NavLinks';
import { NetworkSwitcher, type SwitcherNetwork } from './NetworkSwitcher';
import { AccountMenu } from './AccountMenu';
import { can, type Role } from '@/src/auth/permissions';

export interface ShellUser {
  name: string;
  email: string;
  isAdmin: boolean;
}

/** The network's sections; the audit trail only for roles that may read it. */
export function networkNav(networkId: string, role?: Role): NavItem[] {
  const base = `/n/${networkId}`;
  const audit = can(role, 'audit.read') ? [{ href: `${base}/audit`, label: 'Audit trail' }] : [];
  return [
    { href: base, label: 'Overview', exact: true },
    { href: `${base}/stations`, label: 'Stations' },
    { href: `${base}/models`, label: 'Cavity models' },
    { href: `${base}/grids`, label: 'Source grids' },
    { href: `${base}/runs`, label: 'Runs' },
    { href: `${base}/members`, label: 'Members' },
    ...audit,
  ];
}

interface AppShellProps {
  user: ShellUser;
  networks: SwitcherNetwork[];
  current?: SwitcherNetwork;
  /** Section navigation; defaults to the network sections when `current` is set. */
  nav?: NavItem[];
  navLabel?: string;
  children: ReactNode;
}

export function AppShell({ user, networks, current, nav, navLabel, children }: AppShellProps) {
  const items = nav ?? (current ? networkNav(current.id, current.role as Role) : undefined);
  return (
    <>
      <SkipLink />
      <header className="sticky top-0 z-30 border-b border-line-strong bg-canvas text-fg">
        <div className="mx-auto flex h-shell max-w-page items-center gap-3 px-4 sm:px-6">
          <Brand href="/networks" />
          <span aria-hidden className="h-6 w-px bg-line-strong" />
          <NetworkSwitcher current={current} networks={networks} />
          <div className="ml-auto flex items-center gap-2">
            <AccountMenu name={user.name} email={user.email} isAdmin={user.isAdmin} />
          </div>
        </div>
        {items ? (
          <div className="border-t border-line">
            <div className="mx-auto max-w-page px-2 sm:px-4">
              <NavLinks items={items} label={navLabel ?? (current ? `${current.name} sections` : 'Sections')} />
            </div>
          </div>
        ) : null}
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-page px-4 py-6 focus:outline-none sm:px-6">
        {children}
      </main>
      <footer className="mx-auto max-w-page px-4 pb-8 text-xs text-muted sm:px-6">
        Cavitas · Schumann-resonance workbench · times in UTC
      </footer>
    </>
  );
}
