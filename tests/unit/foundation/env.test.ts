import { describe, expect, it } from 'vitest';
import { EnvError, parseEnv } from '@/server/env';

const VALID = {
  APP_URL: 'http://localhost:3000',
  DATABASE_HOST: '127.0.0.1',
  DATABASE_PORT: '3307',
  DATABASE_NAME: 'fadeledger',
  DATABASE_USER: 'fadeledger',
  DATABASE_PASSWORD: 'secret',
  SMTP_HOST: '127.0.0.1',
  SMTP_PORT: '1025',
  MAIL_FROM: 'FadeLedger <no-reply@fadeledger.example>',
  STRIPE_SECRET_KEY: 'sk_test_x',
  STRIPE_WEBHOOK_SECRET: 'whsec_x',
  SHARE_LINK_KEY: Buffer.alloc(32, 7).toString('base64'),
  REDIS_URL: 'redis://127.0.0.1:6380/0',
};

function problemsOf(source: Record<string, string | undefined>) {
  try {
    parseEnv(source);
  } catch (error) {
    expect(error).toBeInstanceOf(EnvError);
    return (error as EnvError).problems;
  }
  throw new Error('expected parseEnv to throw');
}

describe('parseEnv', () => {
  it('wants SHARE_LINK_KEY as 32 bytes of base64', () => {
    expect(problemsOf({ ...VALID, SHARE_LINK_KEY: undefined }).map((p) => p.variable)).toEqual(['SHARE_LINK_KEY']);
    expect(problemsOf({ ...VALID, SHARE_LINK_KEY: Buffer.alloc(16).toString('base64') })[0].message).toMatch(/32 random bytes/);
    expect(parseEnv({ ...VALID, SHARE_LINK_KEY: Buffer.alloc(32, 9).toString('base64url') }).SHARE_LINK_KEY).toHaveLength(43);
  });

  it('accepts a complete environment and coerces ports and flags', () => {
    const env = parseEnv({ ...VALID, TRUST_PROXY: 'true' });
    expect(env.DATABASE_PORT).toBe(3307);
    expect(env.SMTP_SECURE).toBe(false);
    expect(env.TRUST_PROXY).toBe(true);
    expect(env.STRIPE_API_HOST).toBeUndefined();
  });

  it('names a missing variable', () => {
    const { DATABASE_PASSWORD: _omit, ...rest } = VALID;
    expect(problemsOf(rest)).toEqual([{ variable: 'DATABASE_PASSWORD', message: 'is missing' }]);
  });

  it('names every malformed variable with the reason', () => {
    const problems = problemsOf({ ...VALID, DATABASE_PORT: 'abc', APP_URL: 'localhost', STRIPE_WEBHOOK_SECRET: 'nope' });
    expect(problems.map((p) => p.variable).sort()).toEqual(['APP_URL', 'DATABASE_PORT', 'STRIPE_WEBHOOK_SECRET']);
    expect(problems.find((p) => p.variable === 'STRIPE_WEBHOOK_SECRET')?.message).toMatch(/whsec_/);
  });

  it('names a missing or malformed REDIS_URL (the campaign queue cannot start without it)', () => {
    expect(problemsOf({ ...VALID, REDIS_URL: undefined }).map((p) => p.variable)).toEqual(['REDIS_URL']);
    expect(problemsOf({ ...VALID, REDIS_URL: 'localhost:6380' })[0].message).toMatch(/redis:\/\//);
  });

  it('puts every problem in the error message so start-up output names them', () => {
    try {
      parseEnv({});
    } catch (error) {
      const message = (error as Error).message;
      for (const name of ['APP_URL', 'DATABASE_HOST', 'SMTP_HOST', 'STRIPE_SECRET_KEY']) expect(message).toContain(name);
      return;
    }
    throw new Error('expected parseEnv({}) to throw');
  });

  describe('edge cases', () => {
    it('treats an empty string as missing', () => {
      expect(problemsOf({ ...VALID, DATABASE_HOST: '' })).toEqual([{ variable: 'DATABASE_HOST', message: 'is missing' }]);
    });
    it('rejects a port out of range', () => {
      expect(problemsOf({ ...VALID, SMTP_PORT: '70000' })[0].variable).toBe('SMTP_PORT');
    });
    it('rejects a database name that could break quoting', () => {
      expect(problemsOf({ ...VALID, DATABASE_NAME: 'x`; DROP' })[0].variable).toBe('DATABASE_NAME');
    });
  });
});
