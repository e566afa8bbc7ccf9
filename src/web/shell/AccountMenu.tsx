'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { apiSend, useApi } from '@/src/web/swr';
import { Menu, MenuLink } from './Menu';
import { ThemeToggle } from './ThemeToggle';

interface Props {
  name: string;
  email: string;
  isAdmin: boolean;
}

export function AccountMenu({ name, email, isAdmin }: Props) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  // Touching the session endpoint renews a session that is past half its life.
  useApi<{ user: unknown }>('/api/auth/session', { revalidateOnFocus: false });

  async function signOut() {
    setBusy(true);
    try {
      await apiSend('POST', '/api/auth/sign-out');
    } finally {
      router.push('/sign-in');
      router.refresh();
    }
  }

  return (
    <Menu
      label={`Account: ${name}`}
      align="right"
      summary={
        <span className="max-w-[12rem] truncate text-sm" aria-hidden>
          {name}
        </span>
      }
    >
      <div className="border-b border-line px-2.5 pt-1 pb-2">
        <p className="text-sm font-medium">{name}</p>
        <p className="text-xs text-muted">{email}</p>
      </div>
      <div className="py-1">
        <MenuLink href="/networks">My networks</MenuLink>
        <MenuLink href="/mail">My mail</MenuLink>
        <MenuLink href="/account">My account</MenuLink>
        {isAdmin ? (
          <>
            <MenuLink href="/admin/mail">Outgoing mail</MenuLink>
            <MenuLink href="/admin/settings">Instance settings</MenuLink>
          </>
        ) : null}
      </div>
      <div className="border-t border-line py-1">
        <ThemeToggle />
      </div>
      <div className="border-t border-line pt-1">
        <button
          type="button"
          onClick={signOut}
          disabled={busy}
          className="block w-full rounded-md px-2.5 py-1.5 text-left text-sm hover:bg-raised disabled:opacity-60"
        >
          {busy ? 'Signing out…' : 'Sign out'}
        </button>
      </div>
    </Menu>
  );
}
