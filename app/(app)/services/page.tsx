import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EditListCard } from '@/components/ui/edit-list-card';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { ServiceForm, type ServiceFormValues } from '@/components/services/service-form';
import { DeleteRowButton } from '@/components/catalogue/delete-button';
import { fixed, orbitalSlot } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';
import { deleteServiceProfile } from '@/server/actions/services';
import { listServiceProfiles } from '@/db/queries/service-profiles';
import { serviceSnapshotOf } from '@/server/studies/snapshot-of';
import type { ServiceProfile } from '@/db/models/service-profile';

export const metadata: Metadata = { title: 'Services' };

const POL = { 'linear-horizontal': 'linear H', 'linear-vertical': 'linear V', circular: 'circular' } as const;

function formValuesOf(row: ServiceProfile): ServiceFormValues {
  const s = serviceSnapshotOf(row);
  const str = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));
  return {
    id: String(row.id),
    name: s.name,
    satelliteName: s.satelliteName,
    satelliteLongitudeDeg: str(s.satelliteLongitudeDeg),
    downlinkFrequencyGHz: str(s.downlinkFrequencyGHz),
    polarization: s.polarization,
    polarizationTiltDeg: str(s.polarizationTiltDeg),
    eirpDbw: str(s.eirpDbw),
    symbolRateMsps: str(s.symbolRateMsps),
    modcod: s.modcod ?? '',
    requiredEsN0Db: str(s.requiredEsN0Db),
    implementationMarginDb: str(s.implementationMarginDb),
    otherLossesDb: str(s.otherLossesDb),
    lnbNoiseTempK: str(s.lnbNoiseTempK),
    antennaNoiseTempK: str(s.antennaNoiseTempK),
    acmModcods: (s.acmModcods ?? []).join(', '),
    notes: row.notes ?? '',
    uplinkEnabled: s.uplink ? 'on' : '',
    uplinkFrequencyGHz: str(s.uplink?.frequencyGHz),
    uplinkTerminalEirpDbw: str(s.uplink?.terminalEirpDbw),
    uplinkHpaPowerW: str(s.uplink?.hpaPowerW),
    uplinkSatelliteGOverTDbK: str(s.uplink?.satelliteGOverTDbK),
    uplinkSymbolRateMsps: str(s.uplink?.symbolRateMsps),
    uplinkRequiredEsN0Db: str(s.uplink?.requiredEsN0Db),
    uplinkImplementationMarginDb: str(s.uplink?.implementationMarginDb),
  };
}

export default async function ServicesPage() {
  const ctx = await requirePermission('study.read');
  const write = can(ctx.role, 'service.write');
  const rows = await listServiceProfiles(ctx.companyId);
  return (
    <>
      <PageHeader title="Satellite services" description="The carriers you sell: orbital position, downlink frequency, polarization, EIRP at your service area, symbol rate and MODCOD. Studies copy the profile they use." />
      <div className="space-y-6">
        <Card aria-labelledby="services-title">
          <CardHeader id="services-title" title={`${rows.length} service${rows.length === 1 ? '' : 's'}`} />
          <CardBody className="px-0 sm:px-0">
            <Table caption="Satellite services">
              <THead>
                <tr>
                  <Th>Service</Th>
                  <Th>Satellite</Th>
                  <Th numeric>Downlink</Th>
                  <Th numeric className="normal-case">EIRP</Th>
                  <Th numeric>Symbol rate</Th>
                  <Th className="normal-case">MODCOD</Th>
                  <Th numeric className="normal-case">Required Es/N0</Th>
                  <Th>Return link</Th>
                </tr>
              </THead>
              <TBody>
                {rows.length === 0 && <EmptyRow colSpan={8}>No services yet.</EmptyRow>}
                {rows.map((row) => {
                  const s = serviceSnapshotOf(row);
                  return (
                    <tr key={row.id}>
                      <Th scope="row" className="align-top font-medium text-stone-900">
                        {s.name}
                      </Th>
                      <Td>
                        {s.satelliteName} <span className="num text-stone-600">{orbitalSlot(s.satelliteLongitudeDeg)}</span>
                      </Td>
                      <Td numeric className="whitespace-nowrap">
                        {fixed(s.downlinkFrequencyGHz, 3)} GHz <span className="block text-xs text-stone-600">{POL[s.polarization]}</span>
                      </Td>
                      <Td numeric>{fixed(s.eirpDbw, 1)} dBW</Td>
                      <Td numeric>{fixed(s.symbolRateMsps, 1)} Msps</Td>
                      <Td>
                        {s.modcod ?? '—'}
                        {s.acmModcods && <span className="block text-xs text-stone-600">ACM: {s.acmModcods.length} MODCODs</span>}
                      </Td>
                      <Td numeric>
                        {fixed(s.requiredEsN0Db, 2)} + {fixed(s.implementationMarginDb, 1)} dB
                      </Td>
                      <Td>{s.uplink ? `${fixed(s.uplink.frequencyGHz, 2)} GHz, ${s.uplink.hpaPowerW !== undefined ? `${fixed(s.uplink.hpaPowerW, 1)} W HPA` : `${fixed(s.uplink.terminalEirpDbw ?? 0, 1)} dBW`}` : 'receive only'}</Td>
                    </tr>
                  );
                })}
              </TBody>
            </Table>
          </CardBody>
        </Card>
        {write && rows.length > 0 && (
          <EditListCard
            id="edit-services-title"
            title="Edit a service"
            description="Studies made earlier keep the figures they were computed with."
            rows={rows.map((row) => ({
              id: row.id,
              name: row.name,
              editor: (
                <>
                  <ServiceForm values={formValuesOf(row)} />
                  <DeleteRowButton action={deleteServiceProfile} id={row.id} label={`Delete ${row.name}`} confirmText={`Delete the service ${row.name}? Studies made with it keep their own copy.`} />
                </>
              ),
            }))}
          />
        )}
        {write && (
          <Card aria-labelledby="add-service-title">
            <CardHeader id="add-service-title" title="Add a service" />
            <CardBody>
              <ServiceForm />
            </CardBody>
          </Card>
        )}
      </div>
    </>
  );
}
