import { describe, expect, it } from 'vitest';
import { DECIDED_STATUSES, effectiveStatus, isDecided, isEditable, isOpen, isShareable, OPEN_STATUSES, QUOTE_STATUSES } from '@/server/quotes/status';
import { QUOTE_LIST_STATUSES } from '@/server/validation/quote';

describe('the quote lifecycle', () => {
  it('open quotes are the ones with the customer; decided ones have an answer', () => {
    expect(QUOTE_STATUSES.filter(isOpen)).toEqual(['sent', 'viewed']);
    expect(QUOTE_STATUSES.filter(isDecided)).toEqual(['accepted', 'declined']);
    expect(QUOTE_STATUSES.filter(isShareable)).toEqual(['draft', 'sent', 'viewed']);
    expect(QUOTE_STATUSES.filter(isEditable)).toEqual(['draft']);
  });
  it('an open quote past its validity day shows as expired before anything wrote it down; others keep their status', () => {
    const now = new Date('2027-01-02T00:00:01Z');
    for (const s of OPEN_STATUSES) expect(effectiveStatus(s, '2027-01-01', now)).toBe('expired');
    for (const s of [...DECIDED_STATUSES, 'draft' as const]) expect(effectiveStatus(s, '2027-01-01', now)).toBe(s);
    expect(effectiveStatus('sent', '2027-01-02', now)).toBe('sent');
  });
  it('the list filter offers every status, plus all and open', () => {
    expect(QUOTE_LIST_STATUSES).toEqual(['all', ...QUOTE_STATUSES, 'open']);
  });

  describe('edge cases', () => {
    it('the last second of the validity day is still valid (UTC)', () => {
      expect(effectiveStatus('viewed', '2027-01-01', new Date('2027-01-01T23:59:59Z'))).toBe('viewed');
    });
  });
});
