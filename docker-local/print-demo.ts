import { DEMO_PASSWORD, DEMO_USERS, DEMO_COMPANIES } from '../db/demo/accounts';

// Printed by `npm start` so a newcomer can sign in as each role straight away.
const url = process.env.APP_URL ?? 'http://localhost:3000';
const companyName = (key: string | null) => DEMO_COMPANIES.find((c) => c.key === key)?.name ?? 'FadeLedger platform';
console.log(`\n  Open ${url}\n\n  Demo sign-ins (password for all: ${DEMO_PASSWORD})`);
for (const u of DEMO_USERS) console.log(`    ${u.role.padEnd(10)} ${u.email.padEnd(34)} ${companyName(u.company)}`);
console.log(`\n  API reference: ${url}/api-reference (an admin of ${DEMO_COMPANIES[0].name} makes keys in Settings → API keys)`);
console.log(`\n  Mail catcher inbox: http://127.0.0.1:${process.env.MAIL_WEB_PORT ?? 1080}/\n`);
