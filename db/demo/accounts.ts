/**
 * The invented demo scenario's accounts. Every name here is made up for FadeLedger's demo;
 * addresses use the reserved .example domain so no message can reach a real inbox.
 */
export const DEMO_PASSWORD = 'demo-fade-2026';

export const DEMO_COMPANIES = [
  { key: 'quillfeather', name: 'Quillfeather Dish & Signal', planCode: 'crew' },
  { key: 'bramblecote', name: 'Bramblecote Aerials', planCode: 'bench' },
] as const;

export const DEMO_USERS = [
  { email: 'admin@quillfeather.example', name: 'Orla Venning', role: 'admin', company: 'quillfeather' },
  { email: 'installer@quillfeather.example', name: 'Tamsin Okereke-Lund', role: 'installer', company: 'quillfeather' },
  { email: 'sales@quillfeather.example', name: 'Bastian Moorcroft', role: 'sales', company: 'quillfeather' },
  { email: 'admin@bramblecote.example', name: 'Ysolde Pratchard', role: 'admin', company: 'bramblecote' },
  { email: 'staff@fadeledger.example', name: 'FadeLedger Operator', role: 'staff', company: null },
] as const;
