import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { AUDIT_LABELS, describeDevice, formatWhen } from '@/components/account/describe';
import type { AuthContext } from '@/server/auth/guards';
import { listUserSessions } from '@/db/queries/sessions';
import { listSecurityEventsForUser } from '@/db/queries/audit';
import { RevokeSessionForm, SignOutEverywhereForm, ChangePasswordForm } from './security-forms';

/** One's own sessions, password and recent sign-in activity (company members and staff alike). */
export async function SecurityScreen({ ctx }: { ctx: AuthContext }) {
  const [sessions, events] = await Promise.all([listUserSessions(ctx.user.id), listSecurityEventsForUser(ctx.user.id, 15)]);
  return (
    <>
      <PageHeader title="Your security" description={`Where ${ctx.user.email} is signed in, your password, and recent sign-in activity.`} />

      <Card className="mb-6" aria-labelledby="sessions-title">
        <CardHeader id="sessions-title" title="Signed-in devices" description="Each browser you signed in with. Sign out one you do not recognise, or all of them." actions={<SignOutEverywhereForm />} />
        <Table caption="Signed-in devices">
          <THead>
            <tr>
              <Th>Device</Th>
              <Th className="hidden sm:table-cell">From</Th>
              <Th className="hidden sm:table-cell">Signed in</Th>
              <Th className="text-right">
                <span className="sr-only">Actions</span>
              </Th>
            </tr>
          </THead>
          <TBody>
            {sessions.length === 0 && <EmptyRow colSpan={4}>No sessions.</EmptyRow>}
            {sessions.map((s) => {
              const current = s.digest === ctx.sessionId;
              return (
                <tr key={s.digest}>
                  <Td>
                    <span className="font-medium text-stone-900">{describeDevice(s.userAgent)}</span>
                    {current && <span className="ml-1.5 whitespace-nowrap rounded bg-ledger-50 px-1.5 py-0.5 text-xs text-ledger-800">this device</span>}
                    <span className="block text-xs text-stone-500 sm:hidden">
                      {formatWhen(s.createdAt)}
                      {s.ip ? ` · ${s.ip}` : ''}
                    </span>
                  </Td>
                  <Td className="hidden sm:table-cell font-mono text-xs text-stone-600">{s.ip ?? 'not recorded'}</Td>
                  <Td className="hidden sm:table-cell whitespace-nowrap text-stone-600">{formatWhen(s.createdAt)}</Td>
                  <Td className="whitespace-nowrap text-right">
                    <RevokeSessionForm digest={s.digest} current={current} />
                  </Td>
                </tr>
              );
            })}
          </TBody>
        </Table>
      </Card>

      <div className="grid gap-6 lg:grid-cols-2">
        <Card aria-labelledby="password-title">
          <CardHeader id="password-title" title="Change password" description="Your other devices are signed out when it changes." />
          <CardBody>
            <ChangePasswordForm email={ctx.user.email} />
          </CardBody>
        </Card>

        <Card aria-labelledby="activity-title">
          <CardHeader id="activity-title" title="Recent activity" description="Sign-ins, failed attempts and password changes on your account." />
          <ul className="divide-y divide-stone-200">
            {events.length === 0 && <li className="px-5 py-4 text-sm text-stone-500">Nothing yet.</li>}
            {events.map((e) => (
              <li key={e.id} className="px-4 py-2.5 text-sm sm:px-5">
                <p className="text-stone-800">{AUDIT_LABELS[e.action].replace(/ for$/, '')}</p>
                <p className="text-xs text-stone-500">
                  {formatWhen(e.createdAt)} · {describeDevice(e.userAgent)}
                  {e.ip ? ` · ${e.ip}` : ''}
                </p>
              </li>
            ))}
          </ul>
        </Card>
      </div>
    </>
  );
}
