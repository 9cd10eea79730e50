import { loadTestEnv } from '../support/test-env';

// Each worker loads the test environment itself: it must not depend on inheriting it.
loadTestEnv();

// Next's build defines this from next.config's experimental.authInterrupts (forbidden()); vitest
// runs the source without that build step, so it is set here from the same config.
// @ts-expect-error -- next.config.mjs is plain JavaScript without declarations.
import nextConfig from '../../next.config.mjs';
if ((nextConfig as { experimental?: { authInterrupts?: boolean } }).experimental?.authInterrupts) process.env.__NEXT_EXPERIMENTAL_AUTH_INTERRUPTS = 'true';
