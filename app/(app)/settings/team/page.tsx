import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { Table, THead, TBody, Th, Td, EmptyRow } from '@/components/ui/table';
import { Notice } from '@/components/ui/notice';
import { InviteForm } from '@/components/team/invite-form';
import { RoleForm, RemoveMemberForm } from '@/components/team/member-actions';
import { InvitationActions } from '@/components/team/invitation-actions';
import { requirePermission } from '@/server/auth/guards';
import { can, ROLE_LABELS, ROLE_DESCRIPTIONS } from '@/server/auth/permissions';
import { getPlanLimits, seatsInUse } from '@/server/billing/limits';
import { listMembers } from '@/db/queries/team';
import { listOpenInvitations } from '@/db/queries/invitations';

export const metadata: Metadata = { title: 'Team' };

const dateFmt = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

export default async function TeamPage() {
  const ctx = await requirePermission('team.read');
  const [members, invitations, limits, used] = await Promise.all([listMembers(ctx.companyId), listOpenInvitations(ctx.companyId), getPlanLimits(ctx.companyId), seatsInUse(ctx.companyId)]);
  const manage = can(ctx.role, 'team.manage');
  const pending = invitations.filter((i) => !i.expired).length;
  const full = used >= limits.seats;
  const admins = members.filter((m) => m.role === 'admin').length;
  return (
    <>
      <PageHeader title="Team" description={`People who work in ${ctx.company.name}'s account, and what their role lets them do.`} />

      <Card className="mb-6" aria-labelledby="seats-title">
        <CardBody className="flex flex-wrap items-center justify-between gap-4">
          <div>
            <h2 id="seats-title" className="text-sm font-medium text-stone-600">
              Seats on the {limits.planName} plan
            </h2>
            <p className="mt-0.5 text-stone-900">
              <span className="num text-2xl font-semibold">{used}</span>
              <span className="text-stone-500"> of </span>
              <span className="num text-2xl font-semibold">{limits.seats}</span>
              <span className="ml-2 text-sm text-stone-600">
                ({members.length} {members.length === 1 ? 'member' : 'members'}, {pending} pending {pending === 1 ? 'invitation' : 'invitations'})
              </span>
            </p>
          </div>
          <div className="h-2 w-full max-w-xs overflow-hidden rounded bg-stone-100" role="meter" aria-valuemin={0} aria-valuemax={limits.seats} aria-valuenow={used} aria-label="Seats used">
            <div className={`h-full ${full ? 'bg-amber-500' : 'bg-ledger-600'}`} style={{ width: `${Math.min(100, (used / Math.max(1, limits.seats)) * 100)}%` }} />
          </div>
        </CardBody>
      </Card>

      {manage && (
        <Card className="mb-6" aria-labelledby="invite-title">
          <CardHeader id="invite-title" title="Invite a colleague" description="They get an e-mail with a link that works once, for 7 days. A pending invitation holds a seat." />
          <CardBody>
            {full && (
              <Notice tone="caution" className="mb-4">
                Every seat is taken. Revoke an invitation or remove a member to free one, or move to a larger plan under Billing.
              </Notice>
            )}
            <InviteForm />
            <details className="mt-4 text-sm text-stone-600">
              <summary className="cursor-pointer text-ledger-700">What each role can do</summary>
              <dl className="mt-2 grid gap-2 sm:grid-cols-3">
                {(['admin', 'installer', 'sales'] as const).map((r) => (
                  <div key={r} className="rounded border border-stone-200 px-3 py-2">
                    <dt className="font-medium text-stone-800">{ROLE_LABELS[r]}</dt>
                    <dd className="mt-0.5">{ROLE_DESCRIPTIONS[r]}</dd>
                  </div>
                ))}
              </dl>
            </details>
          </CardBody>
        </Card>
      )}

      <Card className="mb-6" aria-labelledby="members-title">
        <CardHeader id="members-title" title="Members" description="The last admin can be neither removed nor given another role." />
        <Table caption="Members">
          <THead>
            <tr>
              <Th>Name</Th>
              <Th className="hidden md:table-cell">E-mail</Th>
              <Th>Role</Th>
              <Th className="hidden sm:table-cell">Joined</Th>
              {manage && (
                <Th className="hidden text-right sm:table-cell">
                  <span className="sr-only">Actions</span>
                </Th>
              )}
            </tr>
          </THead>
          <TBody>
            {members.map((m) => {
              const self = m.userId === ctx.user.id;
              // The server refuses it anyway; the last admin simply gets no remove control.
              const removable = !(m.role === 'admin' && admins <= 1);
              return (
                <tr key={m.membershipId}>
                  <Td>
                    <span className="font-medium text-stone-900">{m.name}</span>
                    {self && <span className="ml-1.5 rounded bg-stone-100 px-1.5 py-0.5 text-xs text-stone-600">you</span>}
                    <span className="block max-w-[10rem] truncate text-xs text-stone-500 sm:max-w-xs md:hidden">{m.email}</span>
                    {manage && removable && (
                      // On phones the remove control sits under the name, so nothing hides off-screen.
                      <div className="-ml-2.5 mt-1 flex sm:hidden">
                        <RemoveMemberForm membershipId={m.membershipId} name={m.name} self={self} />
                      </div>
                    )}
                  </Td>
                  <Td className="hidden md:table-cell text-stone-700">{m.email}</Td>
                  <Td>{manage ? <RoleForm membershipId={m.membershipId} role={m.role} name={m.name} /> : ROLE_LABELS[m.role]}</Td>
                  <Td className="hidden sm:table-cell whitespace-nowrap text-stone-600">{dateFmt.format(m.joinedAt)}</Td>
                  {manage && (
                    <Td className="hidden text-right sm:table-cell">
                      {removable ? <RemoveMemberForm membershipId={m.membershipId} name={m.name} self={self} /> : <span className="text-xs text-stone-500">only admin</span>}
                    </Td>
                  )}
                </tr>
              );
            })}
          </TBody>
        </Table>
      </Card>

      <Card aria-labelledby="invitations-title">
        <CardHeader id="invitations-title" title="Invitations" description="Resending sends a new link; the earlier one stops working. An expired invitation frees its seat." />
        <Table caption="Open invitations">
          <THead>
            <tr>
              <Th>E-mail</Th>
              <Th>Role</Th>
              <Th className="hidden sm:table-cell">Invited by</Th>
              <Th className="hidden sm:table-cell">Expires</Th>
              {manage && (
                <Th className="hidden text-right sm:table-cell">
                  <span className="sr-only">Actions</span>
                </Th>
              )}
            </tr>
          </THead>
          <TBody>
            {invitations.length === 0 && <EmptyRow colSpan={5}>No open invitations.</EmptyRow>}
            {invitations.map((i) => (
              <tr key={i.id}>
                <Td className="font-medium text-stone-900">
                  <span className="block max-w-[11rem] truncate sm:max-w-[16rem]" title={i.email}>
                    {i.email}
                  </span>
                  {i.expired && <span className="rounded bg-amber-50 px-1.5 py-0.5 text-xs font-normal text-amber-800">expired</span>}
                  {manage && (
                    <div className="-ml-2.5 mt-1 sm:hidden">
                      <InvitationActions invitationId={i.id} email={i.email} />
                    </div>
                  )}
                </Td>
                <Td>{ROLE_LABELS[i.role]}</Td>
                <Td className="hidden sm:table-cell text-stone-600">{i.invitedByName ?? '—'}</Td>
                <Td className="hidden sm:table-cell whitespace-nowrap text-stone-600">{dateFmt.format(i.expiresAt)}</Td>
                {manage && (
                  <Td className="hidden text-right sm:table-cell">
                    <InvitationActions invitationId={i.id} email={i.email} />
                  </Td>
                )}
              </tr>
            ))}
          </TBody>
        </Table>
      </Card>
    </>
  );
}
