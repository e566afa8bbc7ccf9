'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { apiSend } from '@/src/web/swr';
import { Button } from '@/src/web/ui';

export function SignOutButton() {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  return (
    <Button
      busy={busy}
      className="w-full"
      onClick={async () => {
        setBusy(true);
        try {
          await apiSend('POST', '/api/auth/sign-out');
        } finally {
          router.push('/sign-in');
          router.refresh();
        }
      }}
    >
      Sign out
    </Button>
  );
}
