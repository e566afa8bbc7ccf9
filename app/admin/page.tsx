import { redirect } from 'next/navigation';
import { pageAdmin } from '@/src/auth/pages';

export default async function AdminHome() {
  await pageAdmin();
  redirect('/admin/mail');
}
