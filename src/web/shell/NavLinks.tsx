'use client';
import Link from 'next/link';
import { usePathname } from 'next/navigation';
import { cx } from '@/src/web/ui/cx';

export interface NavItem {
  href: string;
  label: string;
  /** Match only the exact path (for an overview page). */
  exact?: boolean;
}

/** Section navigation; the current section carries aria-current="page". */
export function NavLinks({ items, label }: { items: NavItem[]; label: string }) {
  const pathname = usePathname() ?? '';
  return (
    <nav aria-label={label} className="-mb-px flex gap-1 overflow-x-auto">
      {items.map((item) => {
        const active = item.exact ? pathname === item.href : pathname === item.href || pathname.startsWith(item.href + '/');
        return (
          <Link
            key={item.href}
            href={item.href}
            aria-current={active ? 'page' : undefined}
            className={cx(
              'border-b-2 px-3 py-2.5 text-sm font-medium whitespace-nowrap no-underline transition-colors',
              active
                ? 'border-accent font-semibold text-fg'
                : 'border-transparent text-muted hover:border-line-strong hover:text-fg',
            )}
          >
            {item.label}
          </Link>
        );
      })}
    </nav>
  );
}
