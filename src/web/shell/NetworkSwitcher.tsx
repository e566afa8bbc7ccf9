import { Menu, MenuLink } from './Menu';

export interface SwitcherNetwork {
  id: string;
  name: string;
  role: string;
}

/** Header control: the current network and a list to switch to another. */
export function NetworkSwitcher({ current, networks }: { current?: SwitcherNetwork; networks: SwitcherNetwork[] }) {
  return (
    <Menu
      label={current ? ', switch network' : ', choose a network'}
      summary={
        <span className="flex max-w-[14rem] flex-col items-start leading-tight">
          <span className="text-2xs tracking-wider text-chrome-muted uppercase">Network</span>
          <span className="truncate font-medium">{current?.name ?? 'Choose…'}</span>
        </span>
      }
    >
      <p className="px-2.5 pt-1 pb-1.5 text-xs text-muted">Switch network</p>
      {networks.map((n) => (
        <MenuLink key={n.id} href={`/n/${n.id}`} current={n.id === current?.id}>
          <span className="flex items-center justify-between gap-3">
            <span className="truncate">{n.name}</span>
            <span className="text-xs text-muted capitalize">{n.role}</span>
          </span>
        </MenuLink>
      ))}
      <div className="mt-1 border-t border-line pt-1">
        <MenuLink href="/networks#new">+ New network</MenuLink>
      </div>
    </Menu>
  );
}
