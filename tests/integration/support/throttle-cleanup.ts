import { models } from '@/db/models';

/**
 * Sign-in failures of the addresses a test file used, taken out again when it ends: every
 * untrusted failure counts against the global sign-in budget, which other files (and other
 * people's runs against the same database) share for the next quarter hour.
 */
export function attemptsTracker(): { track: (email: string) => string; forget: () => Promise<void> } {
  const emails = new Set<string>();
  return {
    track: (email) => (emails.add(email.toLowerCase()), email),
    forget: async () => {
      if (emails.size) await models().SignInAttempt.destroy({ where: { email: [...emails] } });
      emails.clear();
    },
  };
}
