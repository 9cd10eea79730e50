import type { Metadata } from 'next';
import { requireRole } from '@/server/auth/guards';
import { SecurityScreen } from '@/components/account/security-screen';

export const metadata: Metadata = { title: 'Your security' };

/** Staff have no company pages, so their own security page lives here. */
export default async function StaffSecurityPage() {
  return <SecurityScreen ctx={await requireRole('staff')} />;
}
