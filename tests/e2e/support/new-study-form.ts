import type { Page } from '@playwright/test';

/**
 * Opens the new-study form and types in a new customer and site and picks the service by name;
 * the caller adds what its test needs (more services, dishes, target) and presses "Compute study".
 */
export async function fillNewCustomerStudy(page: Page, o: { customer: string; site: string; latitude: string; longitude: string; altitudeM?: string; service: string }): Promise<void> {
  await page.goto('/studies/new');
  await page.getByRole('radio', { name: 'New customer' }).check();
  await page.getByLabel('Customer name').fill(o.customer);
  await page.getByLabel('Site name').fill(o.site);
  await page.getByLabel('Latitude').fill(o.latitude);
  await page.getByLabel('Longitude').fill(o.longitude);
  if (o.altitudeM !== undefined) await page.getByLabel('Altitude (m above sea level)').fill(o.altitudeM);
  const value = await page.locator('select[name=serviceProfileId] option', { hasText: o.service }).first().getAttribute('value');
  await page.getByLabel('Satellite service').selectOption(value!);
}
