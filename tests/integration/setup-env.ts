import { loadTestEnv } from '../support/test-env';

// Each worker loads the test environment itself: it must not depend on inheriting it.
loadTestEnv();
