import { NeutralNotFound } from '@/components/ui/neutral-not-found';

/** Every unknown address, customer links included: says nothing about who runs the site. */
export default function NotFound() {
  return <NeutralNotFound />;
}
