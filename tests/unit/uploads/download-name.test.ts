import { describe, expect, it } from 'vitest';
import { attachmentDisposition } from '@/server/uploads/download-name';
import { uploadPermission } from '@/server/uploads/upload-permission';

/** Content-Disposition for kept uploads (RFC 6266 with an RFC 5987 filename*): never a path, never a header break. */
describe('attachmentDisposition', () => {
  it('keeps a plain name as it is', () => {
    expect(attachmentDisposition('dishes-2026.csv', 1)).toBe(`attachment; filename="dishes-2026.csv"; filename*=UTF-8''dishes-2026.csv`);
  });

  it('drops path parts, quotes and non-ASCII from the plain filename; keeps the letters in filename*', () => {
    expect(attachmentDisposition('../../etc/Régions "2026".csv', 7)).toBe(`attachment; filename="R_gions_2026_.csv"; filename*=UTF-8''R%C3%A9gions%202026.csv`);
    expect(attachmentDisposition('C:\\Users\\ana\\normals.csv', 2)).toBe(`attachment; filename="normals.csv"; filename*=UTF-8''normals.csv`);
  });

  it('never lets CR/LF or other control characters into the header', () => {
    const value = attachmentDisposition('rain\r\nSet-Cookie: a=b.csv', 4);
    expect(value).not.toMatch(/[\u0000-\u001f\u007f]/);
    expect(value.startsWith('attachment; filename="rainSet-Cookie_a_b.csv"')).toBe(true);
  });

  describe('edge cases', () => {
    it('a name of dots only, or empty, becomes upload-<id>.csv', () => {
      expect(attachmentDisposition('...', 3)).toBe(`attachment; filename="upload-3.csv"; filename*=UTF-8''upload-3.csv`);
      expect(attachmentDisposition('', 9)).toBe(`attachment; filename="upload-9.csv"; filename*=UTF-8''upload-9.csv`);
    });
    it('a hidden-file name loses its leading dot; a name without extension gets .csv', () => {
      expect(attachmentDisposition('.bashrc', 5)).toBe(`attachment; filename="bashrc.csv"; filename*=UTF-8''bashrc.csv`);
      expect(attachmentDisposition('normals', 6)).toBe(`attachment; filename="normals.csv"; filename*=UTF-8''normals.csv`);
    });
    it('a very long name is cut to 100 ASCII characters', () => {
      const m = /filename="([^"]+)"/.exec(attachmentDisposition(`${'a'.repeat(300)}.csv`, 1));
      expect(m![1].length).toBeLessThanOrEqual(104);
    });
    it('bidi overrides are removed (a name cannot display as something else)', () => {
      expect(attachmentDisposition('report\u202Evsc.exe', 1)).not.toContain('%E2%80%AE');
    });
  });
});

describe('uploadPermission', () => {
  it('the catalogue belongs to catalogue.write, rain files to climate.write', () => {
    expect(uploadPermission('dish-catalogue')).toBe('catalogue.write');
    expect(uploadPermission('rain-curve')).toBe('climate.write');
    expect(uploadPermission('climate-normals')).toBe('climate.write');
  });
});
