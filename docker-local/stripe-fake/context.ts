// What every route and page needs: the state, the event dispatcher and the public base URL.
import type { Store } from './state/store';
import type { Dispatcher } from './webhooks/dispatcher';

export interface FakeContext {
  store: Store;
  /** The one API key this fake accepts (STRIPE_SECRET_KEY, the app's own setting). */
  secretKey: string;
  events: Dispatcher;
  /** Base URL for hosted pages (checkout, portal) as the browser reaches the fake. */
  publicUrl: string;
  log: (line: string) => void;
}
