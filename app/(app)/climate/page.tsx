import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { Notice } from '@/components/ui/notice';
import { ClimateForm } from '@/components/climate/climate-form';
import { DeleteRowButton } from '@/components/catalogue/delete-button';
import { UploadPanel } from '@/components/uploads/upload-panel';
import { RecentUploads } from '@/components/uploads/recent-uploads';
import { fixed } from '@/components/study/format';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';
import { deleteClimateProfile } from '@/server/actions/climate';
import { confirmClimateUpload, previewClimateUpload } from '@/server/actions/uploads';
import { listClimateProfiles } from '@/db/queries/climate-profiles';
import { listUploads } from '@/db/queries/uploads';
import { CLIMATE_KIND_LABELS } from '@/server/validation/climate';
import { resolveRainClimate } from '@/server/engine';
import { rainInputOf } from '@/server/studies/build-scenario';
import { climateSnapshotOf } from '@/server/studies/snapshot-of';
import { MAPS_CLIMATE_NAME } from '@/server/studies/maps-climate';
import { formatDms } from '@/server/validation/coordinates';

export const metadata: Metadata = { title: 'Climate' };

/** R0.01 each profile gives (the figure ITU-R P.618-14 works from), or why it cannot. */
function r001Of(profile: Parameters<typeof climateSnapshotOf>[0]): string {
  try {
    return `${fixed(resolveRainClimate(rainInputOf(climateSnapshotOf(profile))).r001MmH, 1)} mm/h`;
  } catch (e) {
    return `not usable: ${(e as Error).message}`;
  }
}

/** The place a profile was made for, in DMS, or the words the study warning uses. */
function placeOf(p: { latDeg: string | null; lonDeg: string | null }): string {
  return p.latDeg === null || p.lonDeg === null ? 'unknown place' : `${formatDms(Number(p.latDeg), 'lat')}, ${formatDms(Number(p.lonDeg), 'lon')}`;
}

export default async function ClimatePage() {
  const ctx = await requirePermission('study.read');
  const admin = can(ctx.role, 'climate.write');
  const [profiles, uploads] = await Promise.all([
    listClimateProfiles(ctx.companyId),
    admin ? listUploads(ctx.companyId, { kind: ['rain-curve', 'climate-normals'], limit: 5 }) : Promise.resolve([]),
  ]);
  return (
    <>
      <PageHeader
        title="Rain climate profiles"
        description="Every study reads its climate from the site's own coordinates by default (ITU-R digital maps). A profile here overrides the rain climate only, where you hold better local data: a measured curve or monthly normals from the weather service beat a global model."
      />
      <div className="space-y-6">
        <Notice title={MAPS_CLIMATE_NAME}>
          The default for every study: rain rate and P0 (ITU-R P.837-7 Annex 1 from the P.837-7 rainfall and P.1510-1 temperature maps), rain height (P.839-4),
          ground height (P.1511-1), N_wet (P.453-14), and gases (P.676-12 with P.836-6) and clouds (P.840-8), all at the site. Gases, clouds and
          scintillation always come from the maps, also when a profile below overrides the rain climate. A profile should say where its figures were
          measured: a study more than 100 km from that place, or on a profile made for an unknown place, shows a warning.
        </Notice>
        <Card aria-labelledby="profiles-title">
          <CardHeader id="profiles-title" title={`${profiles.length} profile${profiles.length === 1 ? '' : 's'}`} />
          <CardBody className="px-0 sm:px-0">
            <Table caption="Climate profiles">
              <THead>
                <tr>
                  <Th>Profile</Th>
                  <Th className="hidden sm:table-cell">Kind</Th>
                  <Th numeric className="normal-case">R0.01</Th>
                  <Th numeric className="hidden sm:table-cell">0 °C isotherm</Th>
                  <Th className="hidden lg:table-cell">Made for</Th>
                  <Th className="hidden md:table-cell">Source</Th>
                  {admin && <Th><span className="sr-only">Actions</span></Th>}
                </tr>
              </THead>
              <TBody>
                {profiles.length === 0 && <EmptyRow colSpan={admin ? 7 : 6}>No climate profiles yet: every study uses the ITU-R maps at its site.</EmptyRow>}
                {profiles.map((p) => (
                  <tr key={p.id}>
                    <Th scope="row" className="align-top font-medium text-stone-900">
                      {p.name}
                      {/* Phones and tablets: kind, isotherm and source fold under the name, so the table fits. */}
                      <span className="block text-xs font-normal text-stone-600 sm:hidden">{CLIMATE_KIND_LABELS[p.kind]}</span>
                      <span className="block text-xs font-normal text-stone-600 sm:hidden">
                        0 °C isotherm: {p.zeroIsothermKm === null ? 'P.839-4 map at the site' : `${fixed(Number(p.zeroIsothermKm), 2)} km`}
                      </span>
                      <span className="block text-xs font-normal text-stone-600 lg:hidden">Made for: {placeOf(p)}</span>
                      <span className="block text-xs font-normal text-stone-600 md:hidden">{p.sourceNote}</span>
                    </Th>
                    <Td className="hidden sm:table-cell">{CLIMATE_KIND_LABELS[p.kind]}</Td>
                    <Td numeric className="whitespace-nowrap">{r001Of(p)}</Td>
                    <Td numeric className="hidden whitespace-nowrap sm:table-cell">{p.zeroIsothermKm === null ? <span className="font-sans text-stone-600">P.839-4 map</span> : `${fixed(Number(p.zeroIsothermKm), 2)} km`}</Td>
                    <Td className="hidden whitespace-nowrap lg:table-cell">{p.latDeg === null ? <span className="text-amber-800">unknown place</span> : placeOf(p)}</Td>
                    <Td className="hidden max-w-sm text-stone-700 md:table-cell">
                      {p.sourceNote}
                      {p.uploadId !== null && <span className="block text-xs text-stone-600">from an uploaded file (kept with its report)</span>}
                    </Td>
                    {admin && (
                      <Td>
                        <DeleteRowButton action={deleteClimateProfile} id={p.id} label={`Delete ${p.name}`} confirmText={`Delete the climate profile ${p.name}? Studies made with it keep their own copy.`} />
                      </Td>
                    )}
                  </tr>
                ))}
              </TBody>
            </Table>
          </CardBody>
        </Card>
        {admin && (
          <div className="grid gap-6 xl:grid-cols-2">
            <Card aria-labelledby="upload-climate-title">
              <CardHeader id="upload-climate-title" title="Upload normals or a measured curve" />
              <CardBody>
                <UploadPanel
                  kinds={[
                    { value: 'climate-normals', label: 'Monthly normals', columns: 'month, mean_total_rainfall_mm, mean_surface_temperature_c (12 rows)', example: '1,78.4,4.2' },
                    { value: 'rain-curve', label: 'Measured exceedance curve', columns: 'p_percent, rain_rate_mm_h (must include 0.01 %)', example: '0.01,42.5' },
                  ]}
                  preview={previewClimateUpload}
                  confirm={confirmClimateUpload}
                  needsProfileFields
                />
                {uploads.length > 0 && (
                  <div className="mt-6">
                    <h3 className="text-sm font-semibold text-stone-900">Recent uploads</h3>
                    <RecentUploads uploads={uploads} showKind />
                  </div>
                )}
              </CardBody>
            </Card>
            <Card aria-labelledby="add-climate-title">
              <CardHeader id="add-climate-title" title="Type in a climate" />
              <CardBody>
                <ClimateForm />
              </CardBody>
            </Card>
          </div>
        )}
      </div>
    </>
  );
}
