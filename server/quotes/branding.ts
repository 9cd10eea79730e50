import 'server-only';
import { models } from '@/db/models';
import { clearCompanyLogo, setCompanyLogo } from '@/db/queries/branding';
import { lockCompanyRow } from '@/db/queries/company-lock';
import { assertWithinPlan } from '@/server/plan-limit';
import { InvalidInputError } from '@/server/errors';
import { inspectLogo, LogoImageError, type LogoImage } from './logo-image';

/**
 * Stores the company's quote logo after checking its bytes (PNG/JPEG, ≤ 200 KiB). Only plans
 * with quote branding may set one (PlanLimitError 'quoteBranding' otherwise); the check and the
 * write share the company lock, so a plan change cannot slip between them.
 */
export async function uploadLogo(companyId: number, bytes: Buffer): Promise<LogoImage> {
  let image: LogoImage;
  try {
    image = inspectLogo(bytes);
  } catch (error) {
    if (error instanceof LogoImageError) throw new InvalidInputError(error.message, { logo: [error.message] });
    throw error;
  }
  const { sequelize } = models();
  await sequelize.transaction(async (t) => {
    await assertWithinPlan(await lockCompanyRow(companyId, t), 'quoteBranding');
    await setCompanyLogo(companyId, { mime: image.mime, data: bytes, width: image.width, height: image.height }, t);
  });
  return image;
}

/** Removing is always allowed, whatever the plan. */
export async function removeLogo(companyId: number): Promise<void> {
  await clearCompanyLogo(companyId);
}
