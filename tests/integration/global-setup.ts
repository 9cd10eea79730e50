import { loadTestEnv } from '../support/test-env';

export default function setup(): void {
  loadTestEnv();
}
