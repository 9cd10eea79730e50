// The PDFs' palette: the ledger teal accent and stone neutrals (tailwind.config.ts), one for the quote
// and the study record so both documents read as ours.
export const TEAL = '#1b5955';
export const INK = '#1c1917';
export const MUTED = '#57534e';
export const RULE = '#d6d3d1';
export const TINT = '#eef8f7';
