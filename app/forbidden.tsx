import type { Metadata } from 'next';
import { RoleMessage } from '@/components/account/role-message';

export const metadata: Metadata = { title: 'Not available to your role' };

/** forbidden() anywhere outside the company app (answers 403). */
export default function Forbidden() {
  return <RoleMessage />;
}
