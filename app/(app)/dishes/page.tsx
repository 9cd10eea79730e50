import type { Metadata } from 'next';
import { PageHeader } from '@/components/ui/page-header';
import { Card, CardBody, CardHeader } from '@/components/ui/card';
import { EditListCard } from '@/components/ui/edit-list-card';
import { EmptyRow, Table, TBody, THead, Td, Th } from '@/components/ui/table';
import { DishForm } from '@/components/catalogue/dish-form';
import { DeleteRowButton } from '@/components/catalogue/delete-button';
import { UploadPanel } from '@/components/uploads/upload-panel';
import { RecentUploads } from '@/components/uploads/recent-uploads';
import { fixed } from '@/components/study/format';
import { diameterLabel } from '@/server/study-option';
import { formatMoney } from '@/server/money-format';
import { sumAmounts } from '@/server/quotes/totals';
import { requirePermission } from '@/server/auth/guards';
import { can } from '@/server/auth/permissions';
import { deleteDish } from '@/server/actions/catalogue';
import { confirmCatalogueUpload, previewCatalogueUpload } from '@/server/actions/uploads';
import { listDishes } from '@/db/queries/dishes';
import { listUploads } from '@/db/queries/uploads';

export const metadata: Metadata = { title: 'Dishes' };

export default async function DishesPage() {
  const ctx = await requirePermission('study.read');
  const admin = can(ctx.role, 'catalogue.write');
  const [dishes, uploads] = await Promise.all([listDishes(ctx.companyId), admin ? listUploads(ctx.companyId, { kind: 'dish-catalogue', limit: 5 }) : Promise.resolve([])]);
  return (
    <>
      <PageHeader
        title="Dish catalogue"
        description="The dishes your studies compare, with your prices. A study copies the rows it uses, so editing a price here never changes a study or quote made earlier."
      />
      <div className="space-y-6">
        <Card aria-labelledby="catalogue-title">
          <CardHeader id="catalogue-title" title={`${dishes.length} dish${dishes.length === 1 ? '' : 'es'}`} description={admin ? 'Change a dish under “Edit the catalogue” below; prices are in USD.' : 'Only an admin can change the catalogue.'} />
          <CardBody className="px-0 sm:px-0">
            <Table caption="Dish catalogue">
              <THead>
                <tr>
                  <Th>Dish</Th>
                  <Th numeric>Diameter</Th>
                  <Th numeric className="hidden sm:table-cell">Efficiency</Th>
                  <Th numeric className="hidden md:table-cell">Hardware</Th>
                  <Th numeric className="hidden md:table-cell">Labour</Th>
                  <Th numeric>Installed</Th>
                  <Th className="hidden lg:table-cell">Mount</Th>
                  <Th className="hidden sm:table-cell">Status</Th>
                </tr>
              </THead>
              <TBody>
                {dishes.length === 0 && <EmptyRow colSpan={8}>No dishes yet.</EmptyRow>}
                {dishes.map((d) => {
                  const size = diameterLabel(Number(d.diameterM));
                  return (
                    <tr key={d.id} className={d.active ? '' : 'text-stone-600'}>
                      <Th scope="row" className="whitespace-nowrap align-top font-medium text-stone-900">
                        {d.name}
                      </Th>
                      <Td numeric className="whitespace-nowrap">
                        {size.cm} <span className="text-xs text-stone-600">({size.inches})</span>
                      </Td>
                      <Td numeric className="hidden sm:table-cell">{fixed(Number(d.efficiency), 2)}</Td>
                      <Td numeric className="hidden md:table-cell">{formatMoney(d.hardwarePrice)}</Td>
                      <Td numeric className="hidden md:table-cell">{formatMoney(d.labourPrice)}</Td>
                      <Td numeric>{formatMoney(sumAmounts(d.hardwarePrice, d.labourPrice))}</Td>
                      <Td className="hidden max-w-xs text-stone-700 lg:table-cell">{d.mountNotes ?? '—'}</Td>
                      <Td className="hidden sm:table-cell">{d.active ? 'offered' : 'not offered'}</Td>
                    </tr>
                  );
                })}
              </TBody>
            </Table>
          </CardBody>
        </Card>
        {admin && dishes.length > 0 && (
          <EditListCard
            id="edit-dishes-title"
            title="Edit the catalogue"
            description="Open a dish to change it, take it out of new studies, or delete it."
            rows={dishes.map((d) => ({
              id: d.id,
              name: d.name,
              editor: (
                <>
                  <DishForm dish={{ id: d.id, name: d.name, diameterM: d.diameterM, efficiency: d.efficiency, hardwarePrice: d.hardwarePrice, labourPrice: d.labourPrice, mountNotes: d.mountNotes, active: d.active }} />
                  <DeleteRowButton action={deleteDish} id={d.id} label={`Delete ${d.name}`} confirmText={`Delete ${d.name} from the catalogue? Studies made with it keep their own copy.`} />
                </>
              ),
            }))}
          />
        )}
        {admin && (
          <div className="grid gap-6 xl:grid-cols-2">
            <Card aria-labelledby="add-dish-title">
              <CardHeader id="add-dish-title" title="Add a dish" />
              <CardBody>
                <DishForm />
              </CardBody>
            </Card>
            <Card aria-labelledby="upload-dish-title">
              <CardHeader id="upload-dish-title" title="Upload a price list" description="Dishes named in the file are updated; new names are added; the others stay as they are." />
              <CardBody>
                <UploadPanel
                  kinds={[{ value: 'dish-catalogue', label: 'Dish catalogue', columns: 'name, diameter_m, efficiency, hardware_price, labour_price, mount_notes (optional), active (optional yes/no)', example: 'Ledger 90,0.90,0.67,189.00,160.00,Pole mount,yes' }]}
                  preview={previewCatalogueUpload}
                  confirm={confirmCatalogueUpload}
                  needsProfileFields={false}
                />
                {uploads.length > 0 && (
                  <div className="mt-6">
                    <h3 className="text-sm font-semibold text-stone-900">Recent uploads</h3>
                    <RecentUploads uploads={uploads} />
                  </div>
                )}
              </CardBody>
            </Card>
          </div>
        )}
      </div>
    </>
  );
}
