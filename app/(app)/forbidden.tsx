import type { Metadata } from 'next';
import { RoleMessage } from '@/components/account/role-message';

export const metadata: Metadata = { title: 'Not available to your role' };

/** forbidden() in a company page (answers 403), inside the app's own menu. */
export default function Forbidden() {
  return <RoleMessage />;
}
