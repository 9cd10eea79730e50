import type { Permission } from '@/server/auth/permissions';
import type { UploadKindName } from './parse-report';

/** Who owns each kind of upload: the dish catalogue is catalogue.write, rain files climate.write (server/actions/uploads.ts). */
export function uploadPermission(kind: UploadKindName): Permission {
  return kind === 'dish-catalogue' ? 'catalogue.write' : 'climate.write';
}
