import 'server-only';
import { Lucia, TimeSpan } from 'lucia';
import { getEnv } from '@/server/env';
import { SequelizeSessionAdapter, type ActiveMembership } from './sequelize-adapter';

export const SESSION_COOKIE_NAME = 'fl_session';
/** Sessions slide: lucia extends one that is used in the second half of this span. */
export const SESSION_LIFETIME = new TimeSpan(30, 'd');

function makeLucia() {
  return new Lucia(new SequelizeSessionAdapter(), {
    sessionExpiresIn: SESSION_LIFETIME,
    sessionCookie: {
      name: SESSION_COOKIE_NAME,
      // httpOnly is lucia's default; sameSite=lax keeps the cookie off cross-site POSTs. Secure
      // whenever the app is served over TLS (production behind a load balancer), so local http works.
      attributes: { sameSite: 'lax', secure: getEnv().APP_URL.startsWith('https:') },
    },
    // activeMembership is only there when the session was just read (validateSession), never stored.
    getSessionAttributes: (a) => ({ activeCompanyId: a.activeCompanyId, activeMembership: a.activeMembership }),
    getUserAttributes: (a) => ({ email: a.email, name: a.name, isStaff: a.isStaff }),
  });
}

const holder = globalThis as unknown as { __fadeledgerLucia?: ReturnType<typeof makeLucia> };

/** The one lucia instance (created on first use so that importing it reads no environment). */
export function getLucia(): ReturnType<typeof makeLucia> {
  holder.__fadeledgerLucia ??= makeLucia();
  return holder.__fadeledgerLucia;
}

declare module 'lucia' {
  interface Register {
    Lucia: ReturnType<typeof makeLucia>;
    UserId: string;
    DatabaseUserAttributes: { email: string; name: string; isStaff: boolean };
    DatabaseSessionAttributes: {
      activeCompanyId: number | null;
      ip: string | null;
      userAgent: string | null;
      /** Filled when read back from the database. */
      createdAt?: Date;
      /** sha256 digest of the token: the row's key, safe to show and to revoke by. */
      digest?: string;
      /** Read with the session (sequelize-adapter.ts): the membership of the active company and its plan. */
      activeMembership?: ActiveMembership | null;
    };
  }
}
