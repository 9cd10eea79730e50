import { describe, expect, it } from 'vitest';
import { endSentence } from '@/server/quotes/sentence';
import { decisionRecipients } from '@/server/quotes/decision-recipients';
import { contactSentence, replyToFor, sellerContact } from '@/server/quotes/seller-contact';
import { winAnsi } from '@/server/quotes/pdf/win-ansi';

describe('sentences that end in a typed name', () => {
  it('adds a full stop only when the name has none', () => {
    expect(endSentence('Long barn roof, for Gullwing Reef Research Buoy Co.')).toBe('Long barn roof, for Gullwing Reef Research Buoy Co.');
    expect(endSentence('Long barn roof, for Fenwold Farm')).toBe('Long barn roof, for Fenwold Farm.');
    expect(endSentence('Is it? ')).toBe('Is it?');
    expect(endSentence('chosen by “Marsh & Co.”')).toBe('chosen by “Marsh & Co.”');
  });
});

describe('who hears of a decision', () => {
  const author = { name: 'Ina Installer', email: 'ina@fenwold.example' };
  const seller = { name: 'Sam Sales', email: 'sam@fenwold.example' };
  it('author, everyone who shared it, sender and sales contact, one message per address (case-insensitive)', () => {
    expect(decisionRecipients({ author, sharers: [seller, { ...seller, email: 'SAM@fenwold.example' }], sender: seller, salesContact: { companyName: 'Fenwold Aerials', email: 'desk@fenwold.example' } })).toEqual([
      author,
      seller,
      { email: 'desk@fenwold.example', name: 'Fenwold Aerials sales' },
    ]);
    expect(decisionRecipients({ author, sharers: [], sender: null, salesContact: { companyName: 'Fenwold Aerials', email: 'INA@fenwold.example' } })).toEqual([author]);
    expect(decisionRecipients({ author: null, sharers: [], sender: null, salesContact: { companyName: 'X', email: null } })).toEqual([]);
  });
});

describe('the seller’s contact', () => {
  it('prefers the company’s address from branding, keeps the person’s name, and says how to reach them', () => {
    const c = sellerContact({ name: 'Gullwing Reef Research Buoy Co.', email: 'desk@gullwing.example', phone: '+44 1632 960 014' }, { name: 'Sam Sales', email: 'sam@gullwing.example' });
    expect(c).toEqual({ companyName: 'Gullwing Reef Research Buoy Co.', personName: 'Sam Sales', email: 'desk@gullwing.example', phone: '+44 1632 960 014' });
    expect(contactSentence(c)).toBe('Questions? E-mail desk@gullwing.example or call +44 1632 960 014 to reach Sam Sales at Gullwing Reef Research Buoy Co.');
    expect(contactSentence({ ...c, email: null, phone: null })).toBeNull();
    expect(replyToFor(c, 'SAM@gullwing.example')).toBe('SAM@gullwing.example, desk@gullwing.example');
    expect(replyToFor({ ...c, email: 'sam@gullwing.example' }, 'Sam@gullwing.example')).toBe('Sam@gullwing.example');
  });
});

describe('PDF text', () => {
  it('prints the apostrophe as ASCII so no viewer drops it', () => {
    expect(winAnsi('manufacturer’s instructions')).toBe("manufacturer's instructions");
  });
});
