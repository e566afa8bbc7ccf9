import Link from 'next/link';

export default function NotFound() {
  return (
    <main id="main" className="mx-auto flex min-h-dvh max-w-md flex-col justify-center gap-3 px-6">
      <p className="num text-sm font-medium text-accent">404</p>
      <h1 className="text-2xl font-semibold tracking-tight">Nothing here</h1>
      <p className="text-sm text-muted">
        This page does not exist, or it belongs to a network you are not a member of. Check the address, or ask an owner of the
        network to invite you.
      </p>
      <Link href="/networks" className="text-sm text-accent underline underline-offset-2">
        Go to my networks
      </Link>
    </main>
  );
}
