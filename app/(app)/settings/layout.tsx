import type { ReactNode } from 'react';
import { SettingsTabs } from '@/components/app-shell/nav-links';
import { settingsNavFor } from '@/components/app-shell/nav';
import { requireCompanyUser } from '@/server/auth/guards';

export default async function SettingsLayout({ children }: { children: ReactNode }) {
  const ctx = await requireCompanyUser();
  return (
    <div>
      <SettingsTabs items={settingsNavFor(ctx.role).map(({ label, href }) => ({ label, href }))} />
      {children}
    </div>
  );
}
