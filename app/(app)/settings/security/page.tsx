import type { Metadata } from 'next';
import { requireUser } from '@/server/auth/guards';
import { SecurityScreen } from '@/components/account/security-screen';

export const metadata: Metadata = { title: 'Your security' };

export default async function SecurityPage() {
  return <SecurityScreen ctx={await requireUser()} />;
}
